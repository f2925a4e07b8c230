import type { Page } from 'playwright-core';
import { demoUser } from '../../seeds/data/demo';
import { unnamedControls } from './support/accessible-names';
import { screenshot, viewports, watchErrors, type ViewportName } from './support/browser';
import { signInAs } from './support/sign-in';
import { useBrowserWorld } from './support/world';

jest.setTimeout(300_000);


interface Screen {
  name: string;
  path: string;
  /** Something that is only on the page once it has its data. */
  ready: (page: Page) => Promise<unknown>;
}

const heading = (name: string | RegExp) => (page: Page) => page.getByRole('heading', { name }).first().waitFor();

/** The screens each role works in (the audit screens are walked by the whole-job story). */
const screensFor: Record<string, Screen[]> = {
  admin: [
    { name: 'overview', path: '/', ready: heading('Overview') },
    { name: 'people', path: '/admin', ready: (p) => p.getByText('auditor@gannet-sound.test').first().waitFor() },
    { name: 'outbox', path: '/admin/outbox', ready: heading(/outbox/i) },
  ],
  analyst: [
    { name: 'overview', path: '/', ready: heading('Overview') },
    { name: 'networks', path: '/networks', ready: (p) => p.getByRole('link', { name: /^Gannet Sound buoy relay, version/ }).waitFor() },
    { name: 'import', path: '/networks/import', ready: heading('Import a network') },
    { name: 'network', path: '/networks/1', ready: (p) => p.getByLabel(/^Spectrum plot of/).waitFor({ timeout: 90_000 }) },
    { name: 'start-audit', path: '/audits/new?networkId=1', ready: (p) => p.getByText(/17 edges × 11 rungs × 2 signs/).waitFor() },
    { name: 'account', path: '/account', ready: heading('Account') },
  ],
  auditor: [
    { name: 'overview', path: '/', ready: heading('Overview') },
    { name: 'audits', path: '/audits', ready: heading('Audits') },
    { name: 'help', path: '/help', ready: (p) => p.getByLabel(/^Log-log sketch/).waitFor() },
  ],
  approver: [
    { name: 'overview', path: '/', ready: heading('Overview') },
    // With no audit yet, an approver is told who starts one, not offered a step they cannot take.
    { name: 'audits', path: '/audits', ready: (p) => p.getByText(/once an analyst starts one/).waitFor() },
    { name: 'account', path: '/account', ready: heading('Account') },
  ],
};

async function checkScreen(page: Page, size: ViewportName, label: string) {
  await page.waitForLoadState('networkidle');
  expect(await unnamedControls(page)).toEqual([]);
  const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
  if (size === 'phone') expect(overflow).toBeLessThanOrEqual(0);
  await screenshot(page, `screens-${size}-${label}`);
}

/**
 * Every main screen, for each role that uses it, at phone and wide size:
 * each control has a name Chromium would announce, the phone layout never
 * scrolls sideways, nothing is written to the console; a screenshot of each
 * is kept for the design review (tests/artifacts/screens-*).
 */
describe('every main screen at both sizes', () => {
  const world = useBrowserWorld();

  test('the probe itself finds nameless controls and pictures, and passes named and hidden ones', async () => {
    const page = await world.browser.newPage();
    await page.setContent(`
      <button></button><a href="/x"><svg width="10" height="10"></svg></a><input type="text"><div tabindex="0"></div>
      <svg role="img" width="10" height="10"></svg>
      <button>Named</button><label>Field <input type="text"></label><svg aria-hidden="true" width="10" height="10"></svg>
      <div role="img" aria-label="A drawing"></div>`);
    const found = await unnamedControls(page);
    expect(found.map((f) => f.split(':')[0]).sort()).toEqual(['button (focusable)', 'generic (focusable)', 'image', 'link (focusable)', 'textbox (focusable)'].sort());
    await page.close();
  });

  for (const size of Object.keys(viewports) as ViewportName[]) {
    test(`signed out, at ${size}`, async () => {
      const page = await world.browser.newPage({ viewport: viewports[size] });
      const errors = watchErrors(page);
      await page.goto(world.server.url + '/sign-in', { waitUntil: 'networkidle' });
      await page.getByRole('button', { name: 'Sign in' }).waitFor();
      await checkScreen(page, size, 'sign-in');
      await page.goto(world.server.url + '/reset-password', { waitUntil: 'networkidle' });
      await page.getByRole('heading').first().waitFor();
      await checkScreen(page, size, 'reset-password');
      expect(errors).toEqual([]);
      await page.close();
    });

    for (const [role, screens] of Object.entries(screensFor)) {
      test(`${role}'s screens at ${size}`, async () => {
        const context = await world.browser.newContext({ viewport: viewports[size] });
        const page = await context.newPage();
        const errors = watchErrors(page);
        const who = demoUser(role);
        await signInAs(page, world.server.url, who.email, who.password);
        for (const screen of screens) {
          await page.goto(world.server.url + screen.path, { waitUntil: 'networkidle' });
          await screen.ready(page);
          await checkScreen(page, size, `${role}-${screen.name}`);
        }
        expect(errors).toEqual([]);
        await context.close();
      });
    }
  }
});
