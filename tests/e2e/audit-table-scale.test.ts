import { randomNetwork } from '../../lib/spectral';
import { demoUser } from '../../seeds/data/demo';
import { screenshot, unexpectedErrors } from './support/browser';
import { signedInContext } from './support/sign-in';
import { useBrowserWorld } from './support/world';

jest.setTimeout(300_000);

const analyst = demoUser('analyst');

/**
 * A 1,000-edge audit (a seeded random network) in the wide table: sorting,
 * filtering and paging are done by the server, so the browser only ever
 * renders one page. The figures are printed for the notes, not asserted.
 */
describe('a 1,000-edge audit table in Chromium', () => {
  const world = useBrowserWorld();

  test('sorts, filters and pages without visible lag', async () => {
    // 40 nodes keep each eigen-solve cheap; a short one-sign ladder keeps the 1,000-edge sweep to seconds.
    const net = randomNetwork({ nodes: 40, edgesPerNode: 25, seed: 7 });
    const text = ['source,target,weight', ...net.edges.slice(0, 1000).map((e) => `${e.source},${e.target},${e.weight}`)].join('\n');
    const { page, errors, close } = await signedInContext(world.browser, world.server.url, analyst, 'wide');
    const auditId = await page.evaluate(async (csv) => {
      const post = (url: string, body: unknown) =>
        fetch(url, { method: 'POST', headers: { 'Content-Type': 'application/json' }, body: JSON.stringify(body) }).then((r) => r.json());
      const imported = await post('/api/v1/networks/import', { name: 'Korrin thousand-link mesh', text: csv, format: 'csv' });
      const audit = await post('/api/v1/audits', {
        networkId: imported.networkId,
        version: imported.version,
        settings: { ladder: { from: 2, to: 4, step: 1 }, signs: ['plus'], tolerance: 0.01 },
      });
      return audit.id as number;
    }, text);
    await page.goto(`${world.server.url}/audits/${auditId}`, { waitUntil: 'networkidle' });
    await page.getByText('in review', { exact: true }).first().waitFor({ timeout: 180_000 });
    const table = page.getByRole('table', { name: 'Edges' });
    await table.waitFor();
    await page.getByText(/^1000 edges/).waitFor();

    const rowsShown = () => page.locator('[role="row"][aria-label^="Edge "]').count();
    const firstRow = () => page.locator('[role="row"][aria-label^="Edge "]').first().getAttribute('aria-label');
    const timed = async (what: string, act: () => Promise<unknown>, done: () => Promise<unknown>) => {
      const t0 = Date.now();
      await act();
      await done();
      const ms = Date.now() - t0;
      console.log(`1,000-edge table: ${what} in ${ms} ms`);
      return ms;
    };

    const firstChanges = (before: string | null) =>
      page.waitForFunction((b) => document.querySelector('[role="row"][aria-label^="Edge "]')?.getAttribute('aria-label') !== b, before);
    await expect(rowsShown()).resolves.toBe(50);

    let before = await firstRow();
    await timed('next page of 50', () => page.getByRole('button', { name: 'Next ›' }).click(), () => firstChanges(before));
    await page.getByText(/51–100 of 1\u2009000/).waitFor();

    before = await firstRow();
    await timed('sort by tolerance (back to page 1)', () => table.getByRole('columnheader', { name: 'Sort by tolerance |ε|' }).click(), () => firstChanges(before));
    before = await firstRow();
    await timed('reverse the sort', () => table.getByRole('columnheader', { name: 'Sort by tolerance |ε|' }).click(), () => firstChanges(before));
    await expect(table.getByRole('columnheader', { name: 'Sort by tolerance |ε|' }).getAttribute('aria-sort')).resolves.toBe('descending');
    expect(new URL(page.url()).searchParams.get('dir')).toBe('desc');

    await timed('node-name search "n4" (after the typing pause)', () => page.getByLabel('Node name', { exact: true }).fill('n4'), () =>
      page.waitForFunction(() => {
        const names = Array.from(document.querySelectorAll('[role="row"][aria-label^="Edge "]')).map((r) => r.getAttribute('aria-label') ?? '');
        return names.length > 0 && names.every((n) => /\bn4\d*\b/.test(n));
      }),
    );
    await timed('exponent range 0.9–1.1 on top', async () => {
      await page.getByLabel('Exponent from', { exact: true }).fill('0.9');
      await page.getByLabel('Exponent to', { exact: true }).fill('1.1');
    }, () => page.waitForURL(/expMax=1\.1/).then(() => page.waitForLoadState('networkidle')));

    await page.getByRole('button', { name: 'Clear filters' }).click();
    await page.waitForFunction(() => !location.search.includes('q='));
    await timed('200 rows per page', async () => {
      await page.getByRole('button', { name: '50 per page' }).click();
      await page.getByRole('button', { name: '100 per page' }).click();
    }, () => page.waitForFunction(() => document.querySelectorAll('[role="row"][aria-label^="Edge "]').length === 200));
    before = await firstRow();
    await timed('next page of 200', () => page.getByRole('button', { name: 'Next ›' }).click(), () => firstChanges(before));
    await page.getByText(/201–400 of 1\u2009000/).waitFor();
    await screenshot(page, 'audits-1000-wide');
    expect(unexpectedErrors(errors)).toEqual([]);
    await close();
  });
});
