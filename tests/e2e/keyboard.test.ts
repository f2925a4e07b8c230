import type { Page } from 'playwright-core';
import { demoUser } from '../../seeds/data/demo';
import { screenshot, viewports, watchErrors } from './support/browser';
import { signInAs } from './support/sign-in';
import { useBrowserWorld } from './support/world';

jest.setTimeout(180_000);


/** Presses Tab until the focused element matches, at most `limit` times; returns its label. */
async function tabTo(page: Page, match: RegExp, limit = 80): Promise<string> {
  for (let i = 0; i < limit; i++) {
    await page.keyboard.press('Tab');
    const label = await page.evaluate(() => {
      const e = document.activeElement as HTMLElement | null;
      return e ? `${e.getAttribute('aria-label') ?? ''} ${e.textContent ?? ''}`.trim() : '';
    });
    if (match.test(label)) return label;
  }
  throw new Error(`Tab never reached ${match}`);
}

/**
 * The content's controls whose visible part is covered by the edge sheet:
 * the middle of what shows of each (inside its scrolling ancestors and the
 * window) is hit-tested, and a hit inside the sheet means the sheet hides it.
 */
function controlsUnderSheet(page: Page): Promise<string[]> {
  return page.evaluate(() => {
    const sheet = document.querySelector('[aria-label="Selected edge"]');
    const controls = document.querySelectorAll('[role="main"] :is(button, a, input, textarea, [role="button"], [role="link"], [role="checkbox"], [role="radio"], [role="row"])');
    const covered: string[] = [];
    for (const el of Array.from(controls)) {
      if (sheet?.contains(el)) continue;
      let { left, top, right, bottom } = el.getBoundingClientRect();
      for (let a = el.parentElement; a; a = a.parentElement) {
        const style = getComputedStyle(a);
        if (style.overflowX === 'visible' && style.overflowY === 'visible') continue;
        const r = a.getBoundingClientRect();
        left = Math.max(left, r.left); top = Math.max(top, r.top); right = Math.min(right, r.right); bottom = Math.min(bottom, r.bottom);
      }
      left = Math.max(left, 0); top = Math.max(top, 0); right = Math.min(right, window.innerWidth); bottom = Math.min(bottom, window.innerHeight);
      if (right - left < 2 || bottom - top < 2) continue;
      const hit = document.elementFromPoint((left + right) / 2, (top + bottom) / 2);
      if (hit && sheet?.contains(hit)) covered.push(el.getAttribute('aria-label') ?? el.textContent?.slice(0, 40) ?? el.tagName);
    }
    return covered;
  });
}

/**
 * The wide layout with the keyboard alone: an auditor reaches the table,
 * opens a flagged edge, chooses a disposition, writes the note and records
 * it — no mouse.
 */
describe('audit table and disposition form with the keyboard alone', () => {
  const world = useBrowserWorld();

  /** An audit of the demo relay, started by the analyst (through the API: the run itself is not under test here). */
  async function startedAudit(): Promise<number> {
    const context = await world.browser.newContext({ viewport: viewports.wide });
    const analystPage = await context.newPage();
    await signInAs(analystPage, world.server.url, demoUser('analyst').email, demoUser('analyst').password);
    const auditId: number = await analystPage.evaluate(async () => {
      const r = await fetch('/api/v1/audits', { method: 'POST', headers: { 'Content-Type': 'application/json' }, body: JSON.stringify({ networkId: 1, version: 1 }) });
      return (await r.json()).id;
    });
    await context.close();
    return auditId;
  }

  test('an auditor records a disposition without touching the mouse', async () => {
    const auditId = await startedAudit();

    const page = await (await world.browser.newContext({ viewport: viewports.wide })).newPage();
    const errors = watchErrors(page);
    await signInAs(page, world.server.url, demoUser('auditor').email, demoUser('auditor').password);
    await page.goto(`${world.server.url}/audits/${auditId}?flagged=yes`, { waitUntil: 'networkidle' });
    await page.getByText('in review', { exact: true }).first().waitFor({ timeout: 90_000 });
    await page.getByRole('row', { name: /^Edge 0:/ }).waitFor();

    const row = await tabTo(page, /^Edge 0:/);
    expect(row).toMatch(/mast-crest → mast-ledge/);
    await page.keyboard.press('Enter');
    await tabTo(page, /mitigate/);
    await page.keyboard.press('Space');
    await tabTo(page, /^Note/);
    await page.keyboard.type('recalibrate the crest-to-ledge gain every quarter');
    await tabTo(page, /Record disposition/);
    await page.keyboard.press('Enter');

    await page.getByRole('row', { name: /^Edge 0:/ }).getByText(/mitigate/).waitFor({ timeout: 20_000 });
    const saved = await page.evaluate(async (id) => (await (await fetch(`/api/v1/audits/${id}/edges/0`)).json()).disposition, auditId);
    expect(saved).toMatchObject({ kind: 'mitigate', note: 'recalibrate the crest-to-ledge gain every quarter', by: 'Demo Auditor' });
    await screenshot(page, 'keyboard-disposition-wide');
    expect(errors).toEqual([]);
  });

  /**
   * Between 1024 and 1340 px the shell's own pane takes the right edge, so the
   * selected edge opens as a sheet over it, mounted last in the page. Focus
   * must go into the sheet when it opens, and back to the row on Escape.
   */
  test('at 1280×800 the edge sheet takes the focus, keeps a short Tab order, and Escape returns to the row', async () => {
    const auditId = await startedAudit();
    const page = await (await world.browser.newContext({ viewport: { width: 1280, height: 800 } })).newPage();
    const errors = watchErrors(page);
    await signInAs(page, world.server.url, demoUser('auditor').email, demoUser('auditor').password);
    await page.goto(`${world.server.url}/audits/${auditId}?flagged=yes&sort=tolerance`, { waitUntil: 'networkidle' });
    await page.getByText('in review', { exact: true }).first().waitFor({ timeout: 90_000 });
    const firstRow = page.getByRole('row', { name: /^Edge \d+:/ }).first();
    await firstRow.waitFor();
    const rowName = (await firstRow.getAttribute('aria-label'))!;

    await tabTo(page, new RegExp(`^${rowName.split(':')[0]}:`));
    await page.keyboard.press('Enter');
    const sheet = page.getByRole('complementary', { name: 'Selected edge' });
    await sheet.getByLabel(/^Response plot:/).waitFor();
    const focusInSheet = () => page.evaluate(() => !!document.activeElement?.closest('[aria-label="Selected edge"]'));
    await expect(focusInSheet()).resolves.toBe(true);
    // The page makes room for the sheet: no control of the content lies under it, wherever the page is scrolled.
    for (const y of [0, 600, 1200]) {
      await page.evaluate((top) => document.querySelector('[role="main"] [style*="overflow"], main')?.scrollTo?.(0, top), y);
      await expect(controlsUnderSheet(page)).resolves.toEqual([]);
    }

    // From the sheet's top, the disposition choices are a few presses away, not behind the whole page.
    let presses = 0;
    for (; presses < 20; presses++) {
      await page.keyboard.press('Tab');
      const name = await page.evaluate(() => document.activeElement?.getAttribute('aria-label') ?? document.activeElement?.textContent ?? '');
      if (/monitor/.test(name)) break;
    }
    expect(presses).toBeLessThan(20);
    await expect(focusInSheet()).resolves.toBe(true);
    await page.keyboard.press('Space');
    await tabTo(page, /^Note/, 6);
    await page.keyboard.type('watch the drift of this link at every service visit');
    await tabTo(page, /Record disposition/, 4);
    await page.keyboard.press('Enter');
    await sheet.getByText('● Saved').waitFor();
    await screenshot(page, 'keyboard-sheet-1280');

    await page.keyboard.press('Escape');
    await sheet.waitFor({ state: 'detached' });
    const focused = await page.evaluate(() => document.activeElement?.getAttribute('aria-label') ?? '');
    expect(focused.split(',')[0]).toBe(rowName.split(',')[0]);
    await page.getByRole('row', { name: new RegExp(`^${rowName.split(':')[0]}:`) }).getByText(/monitor/).waitFor();

    // At the narrowest wide layout the sheet is slimmer, and the content still moves aside for it.
    await page.setViewportSize({ width: 1024, height: 768 });
    await page.getByRole('row', { name: /^Edge \d+:/ }).first().click();
    await sheet.getByLabel(/^Response plot:/).waitFor();
    await expect(controlsUnderSheet(page)).resolves.toEqual([]);
    await screenshot(page, 'keyboard-sheet-1024');
    expect(errors).toEqual([]);
  });
});
