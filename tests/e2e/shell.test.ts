import { screenshot, viewports, watchErrors, type ViewportName } from './support/browser';
import { useBrowserWorld } from './support/world';
import { signInAs } from './support/sign-in';
import { demoUsers } from '../../seeds/data/demo';

jest.setTimeout(120_000);

/**
 * The shell in a real browser against the served export: the right
 * navigation for each width, the shipped fonts actually in use, no page
 * errors, and no sideways scrolling on a phone.
 */
describe('app shell in Chromium', () => {
  const world = useBrowserWorld();

  for (const name of Object.keys(viewports) as ViewportName[]) {
    test(`renders at ${name} (${viewports[name].width}×${viewports[name].height}) with the shipped fonts`, async () => {
      const page = await world.browser.newPage({ viewport: viewports[name] });
      const errors = watchErrors(page);
      await signInAs(page, world.server.url, demoUsers[1].email, demoUsers[1].password);
      await page.goto(world.server.url + '/', { waitUntil: 'networkidle' });
      await page.evaluate(() => document.fonts.ready);

      await expect(page.getByRole('heading', { name: 'Overview' }).isVisible()).resolves.toBe(true);
      await page.getByText('Server and database answer').waitFor();

      const fonts = await page.evaluate(() => ({
        ui: document.fonts.check('16px SpaceGrotesk_400Regular'),
        mono: document.fonts.check('16px JetBrainsMono_400Regular'),
        loaded: (() => {
          const names: string[] = [];
          document.fonts.forEach((f) => f.status === 'loaded' && names.push(f.family.replace(/"/g, '')));
          return names;
        })(),
      }));
      const headingFont = await page
        .getByRole('heading', { name: 'Overview' })
        .evaluate((el) => getComputedStyle(el).fontFamily);
      // Step numbers are figures: they must be set in the monospaced face.
      const figureFont = await page
        .getByRole('link', { name: /Import a network/ })
        .getByText('1', { exact: true })
        .evaluate((el) => getComputedStyle(el).fontFamily);
      expect(fonts.loaded).toEqual(expect.arrayContaining(['SpaceGrotesk_400Regular', 'JetBrainsMono_400Regular']));
      expect(fonts.ui && fonts.mono).toBe(true);
      expect(headingFont).toContain('SpaceGrotesk_700Bold');
      expect(figureFont).toContain('JetBrainsMono_400Regular');

      const rail = page.getByTestId('side-rail');
      const bar = page.getByTestId('bottom-bar');
      if (name === 'phone') {
        await expect(bar.isVisible()).resolves.toBe(true);
        await expect(rail.isVisible()).resolves.toBe(false);
        const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
        expect(overflow).toBeLessThanOrEqual(0);
      } else {
        await expect(rail.isVisible()).resolves.toBe(true);
        await expect(bar.isVisible()).resolves.toBe(false);
        await expect(page.getByRole('complementary', { name: 'Latest audits' }).isVisible()).resolves.toBe(true);
      }

      await page.getByRole('link', { name: 'Networks' }).first().click();
      await page.getByRole('heading', { name: 'Networks' }).waitFor();
      expect(new URL(page.url()).pathname).toBe('/networks');
      await screenshot(page, `shell-${name}`);
      expect(errors).toEqual([]);
      await page.close();
    });
  }

  test('an unknown address shows the not-found page with status 404', async () => {
    const page = await world.browser.newPage({ viewport: viewports.phone });
    const res = await page.goto(world.server.url + '/no/such/place');
    expect(res?.status()).toBe(404);
    await page.getByRole('heading', { name: 'No such page' }).waitFor();
    await page.close();
  });
});
