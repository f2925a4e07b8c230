import { execFileSync } from 'node:child_process';
import { existsSync, readFileSync } from 'node:fs';
import path from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { randomNetwork } from '../../lib/spectral';
import { demoUsers } from '../../seeds/data/demo';
import { artifactDir, screenshot, viewports, watchErrors, type ViewportName } from './support/browser';
import { signInAs } from './support/sign-in';
import { useBrowserWorld } from './support/world';

jest.setTimeout(300_000);

const person = (role: string) => demoUsers.find((u) => (u.roles as readonly string[]).includes(role))!;
const analyst = person('analyst');
const auditor = person('auditor');
const approver = person('approver');
const networkName = 'Gannet Sound buoy relay';

async function as(browser: Browser, baseUrl: string, who: (typeof demoUsers)[number], size: ViewportName) {
  const context = await browser.newContext({ viewport: viewports[size], acceptDownloads: true });
  const page = await context.newPage();
  const errors = watchErrors(page);
  await signInAs(page, baseUrl, who.email, who.password);
  return { page, errors, close: () => context.close() };
}

async function noSidewaysScroll(page: Page) {
  const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
  expect(overflow).toBeLessThanOrEqual(0);
}

/** Console noise from refusals the test provokes on purpose. */
const unexpected = (errors: string[]) => errors.filter((e) => !/status of (409|403)/.test(e));

/**
 * The whole job with three accounts on the demo relay network, as people
 * would do it: the analyst runs the sweep, the auditor triages the root-type
 * edges and submits, the approver seals it on a phone; after that an edit is
 * refused and the PDF report downloads.
 */
describe('audit run, review and seal in Chromium', () => {
  const world = useBrowserWorld();
  let auditPath = '';

  test('analyst starts an audit from the network page and watches the sweep finish', async () => {
    const { page, errors, close } = await as(world.browser, world.server.url, analyst, 'wide');
    await page.goto(world.server.url + '/networks', { waitUntil: 'networkidle' });
    await page.getByRole('link', { name: new RegExp(`^${networkName}, version`) }).click();
    await page.getByRole('heading', { name: networkName }).waitFor();
    await page.getByRole('button', { name: 'Start an audit' }).click({ timeout: 60_000 });
    await page.getByRole('heading', { name: 'Start an audit' }).waitFor();
    await expect(page.getByLabel('From t', { exact: true }).inputValue()).resolves.toBe('2');
    await expect(page.getByLabel('Tolerance τ (% of Re λ2)', { exact: true }).inputValue()).resolves.toBe('1');
    await page.getByText(/17 edges × 11 rungs × 2 signs/).waitFor();
    await screenshot(page, 'audits-start-wide');

    await page.getByRole('button', { name: 'Start the sweep' }).click();
    await page.waitForURL(/\/audits\/\d+$/);
    auditPath = new URL(page.url()).pathname;
    await page.getByRole('heading', { name: networkName }).waitFor();
    // A 17-edge sweep may finish before the first poll; when the bar is caught, keep a picture of it.
    if (await page.getByRole('progressbar', { name: /edges swept/ }).isVisible()) await screenshot(page, 'audits-progress-wide');
    await page.getByText('in review', { exact: true }).first().waitFor({ timeout: 90_000 });
    await page.getByRole('list', { name: 'Edges per class' }).waitFor();
    await expect(page.getByRole('progressbar', { name: /edges swept/ }).count()).resolves.toBe(0);
    await page.getByText('sweep finished; ready for review').waitFor();
    await page.getByText(/do not replace it, nor the codes and standards/).waitFor();
    // The analyst may look but not dispose or submit.
    await expect(page.getByRole('button', { name: 'Submit for sign-off' }).count()).resolves.toBe(0);
    await screenshot(page, 'audits-ready-wide');
    expect(unexpected(errors)).toEqual([]);
    await close();
  });

  test('auditor filters to root-type edges, reads an edge’s plot, disposes every flagged edge and submits', async () => {
    const { page, errors, close } = await as(world.browser, world.server.url, auditor, 'wide');
    await page.goto(world.server.url + auditPath, { waitUntil: 'networkidle' });
    await page.getByRole('heading', { name: networkName }).waitFor();

    await page.getByRole('checkbox', { name: 'square-root' }).click();
    await page.getByRole('checkbox', { name: 'cube-root' }).click();
    await page.waitForURL(/class=square-root(%2C|,)cube-root/);
    const table = page.getByRole('table', { name: 'Edges' });
    const rows = table.getByRole('row', { name: /^Edge \d+:/ });
    await page.waitForFunction(() => {
      const names = Array.from(document.querySelectorAll('[role="row"][aria-label^="Edge "]')).map((r) => r.getAttribute('aria-label') ?? '');
      return names.length > 0 && names.every((n) => /square-root|cube-root/.test(n));
    });
    const rootRows = await rows.count();
    expect(rootRows).toBeGreaterThan(0);

    // The filtered view survives a reload: it lives in the URL.
    const shared = page.url();
    await page.goto(shared, { waitUntil: 'networkidle' });
    await expect(page.getByRole('checkbox', { name: 'cube-root' }).getAttribute('aria-checked')).resolves.toBe('true');
    await expect(rows.count()).resolves.toBe(rootRows);

    // Sort by tolerance, smallest first, through the column header.
    await table.getByRole('columnheader', { name: 'Sort by tolerance |ε|' }).click();
    await page.waitForURL(/sort=tolerance/);

    await rows.first().click();
    const pane = page.getByRole('complementary', { name: 'Selected edge' });
    await pane.getByLabel(/^Response plot: \d+ points, \d+ used in the fit, [12] fitted line/).waitFor();
    await pane.getByText('Tolerance', { exact: true }).waitFor();
    await screenshot(page, 'audits-filtered-edge-wide');

    // Every flagged edge without a disposition, one after another.
    await page.getByRole('button', { name: 'Clear filters' }).click();
    await page.getByRole('checkbox', { name: 'flagged only' }).click();
    await page.getByRole('checkbox', { name: 'no disposition' }).click();
    await page.waitForURL(/disposition=none/);
    const kinds = ['✓ accept', '△ mitigate', '◎ monitor'];
    let done = 0;
    for (; done < 20; done++) {
      await page.waitForTimeout(300);
      await page.waitForLoadState('networkidle');
      if ((await rows.count()) === 0) break;
      const label = (await rows.first().getAttribute('aria-label')) ?? '';
      await rows.first().click();
      await pane.getByRole('heading', { name: label.replace(/^Edge \d+: /, '').replace(/, [a-z-]+$/, '') }).waitFor();
      await pane.getByRole('radio', { name: kinds[done % 3] }).click();
      await pane.getByLabel('Note', { exact: true }).fill(`Reviewed edge ${label.split(':')[0]} against the relay commissioning sheet.`);
      await pane.getByRole('button', { name: 'Record disposition' }).click();
      await pane.getByText('● Saved').waitFor();
      await page.getByRole('row', { name: label }).waitFor({ state: 'detached' });
    }
    expect(done).toBeGreaterThanOrEqual(rootRows);
    await page.getByText('No edge matches').waitFor();

    await page.getByRole('button', { name: 'Submit for sign-off' }).click();
    await page.getByLabel('Comment (optional)').fill('All root-type edges reviewed; two need watching in service.');
    await page.getByRole('button', { name: 'Submit for sign-off' }).click();
    await page.getByText('awaiting sign-off', { exact: true }).first().waitFor();
    await screenshot(page, 'audits-submitted-wide');
    expect(unexpected(errors)).toEqual([]);
    await close();
  });

  test('auditor on a phone sees cards and an edge on its own page', async () => {
    const { page, errors, close } = await as(world.browser, world.server.url, auditor, 'phone');
    await page.goto(`${world.server.url}${auditPath}?flagged=yes`, { waitUntil: 'networkidle' });
    const cards = page.getByRole('link', { name: /^Edge \d+:/ });
    await cards.first().waitFor();
    await expect(page.getByRole('table', { name: 'Edges' }).isVisible()).resolves.toBe(false);
    await noSidewaysScroll(page);
    await cards.first().scrollIntoViewIfNeeded();
    await screenshot(page, 'audits-cards-phone');
    // Filters and sort fold away on a phone, behind one button.
    await expect(page.getByRole('checkbox', { name: 'cube-root' }).isVisible()).resolves.toBe(false);
    await page.getByRole('button', { name: 'Filters and sort' }).click();
    await page.getByRole('checkbox', { name: 'cube-root' }).click();
    await page.waitForURL(/class=cube-root/);
    await page.getByRole('radio', { name: 'tolerance', exact: true }).click();
    await page.waitForURL(/sort=tolerance/);
    await page.getByRole('checkbox', { name: 'cube-root' }).scrollIntoViewIfNeeded();
    await noSidewaysScroll(page);
    await screenshot(page, 'audits-filters-phone');
    await expect(cards.count()).resolves.toBe(2);
    await cards.first().click();
    await page.waitForURL(/\/edges\/\d+$/);
    await page.getByLabel(/^Response plot:/).waitFor();
    await noSidewaysScroll(page);
    await screenshot(page, 'audits-edge-phone');
    expect(unexpected(errors)).toEqual([]);
    await close();
  });

  test('approver on a phone seals the audit with a comment after a clear confirmation', async () => {
    const { page, errors, close } = await as(world.browser, world.server.url, approver, 'phone');
    // From the list, narrowed to what waits for sign-off.
    await page.getByTestId('bottom-bar').getByRole('link', { name: 'Audits' }).click();
    await page.getByRole('heading', { name: 'Audits' }).waitFor();
    await page.getByRole('checkbox', { name: 'awaiting sign-off' }).click();
    await page.waitForURL(/state=awaiting-sign-off/);
    const card = page.getByRole('link', { name: new RegExp(`^Audit ${auditPath.split('/').pop()}: ${networkName}`) });
    await card.waitFor();
    await card.getByText(/^0\s*without disposition$/).waitFor();
    await noSidewaysScroll(page);
    await screenshot(page, 'audits-list-phone');
    await card.click();
    await page.waitForURL(new RegExp(`${auditPath}$`));
    await page.getByRole('button', { name: 'Seal the audit…' }).click();
    await page.getByText(/It is irreversible/).waitFor();
    await page.getByRole('button', { name: 'Continue to confirmation' }).click();
    await page.getByText('× a comment is required').waitFor();
    await page.getByLabel('Comment (required)').fill('Approved for the spring retune; monitor the crest links.');
    await page.getByRole('button', { name: 'Continue to confirmation' }).click();
    await page.getByRole('alert', { name: 'Confirm sealing' }).waitFor();
    await screenshot(page, 'audits-seal-confirm-phone');
    await page.getByRole('button', { name: 'Seal it — this cannot be undone' }).click();
    await page.getByText(/it matches\. Nothing has changed since sealing/).waitFor();
    await page.getByText('sealed the audit (approved)').waitFor();
    await page.getByText(/The hash chain verifies/).waitFor();
    await noSidewaysScroll(page);
    await page.getByText(/SHA-256 over the results/).scrollIntoViewIfNeeded();
    await screenshot(page, 'audits-sealed-phone');
    expect(unexpected(errors)).toEqual([]);
    await close();
  });

  test('after sealing an edit is refused, and the PDF report downloads', async () => {
    const { page, errors, close } = await as(world.browser, world.server.url, auditor, 'wide');
    await page.goto(world.server.url + auditPath, { waitUntil: 'networkidle' });
    await page.getByText('sealed', { exact: true }).first().waitFor();
    const auditId = auditPath.split('/').pop();
    await page.getByRole('row', { name: /^Edge \d+:/ }).first().click();
    const pane = page.getByRole('complementary', { name: 'Selected edge' });
    await pane.getByLabel(/^Response plot:/).waitFor();
    await expect(pane.getByRole('button', { name: /disposition/ }).count()).resolves.toBe(0);
    // The page offers no form; a request made anyway is refused by the server.
    const refusal = await page.evaluate(async (id) => {
      const res = await fetch(`/api/v1/audits/${id}/edges/0/disposition`, {
        method: 'PUT',
        headers: { 'Content-Type': 'application/json' },
        body: JSON.stringify({ kind: 'accept', note: 'trying after the seal' }),
      });
      return { status: res.status, body: await res.json() };
    }, auditId);
    expect(refusal.status).toBe(409);
    expect(refusal.body.error.code).toBe('sealed');
    await screenshot(page, 'audits-sealed-wide');

    const download = page.waitForEvent('download');
    await page.getByRole('link', { name: '↓ PDF sign-off report' }).click();
    const file = path.join(artifactDir, 'audits-report.pdf');
    await (await download).saveAs(file);
    expect(readFileSync(file).subarray(0, 5).toString()).toBe('%PDF-');
    if (existsSync('/usr/bin/pdftoppm')) {
      execFileSync('/usr/bin/pdftoppm', ['-png', '-r', '60', '-f', '1', '-l', '1', '-singlefile', file, path.join(artifactDir, 'audits-report-page1')]);
      expect(existsSync(path.join(artifactDir, 'audits-report-page1.png'))).toBe(true);
    }

    const csv = page.waitForEvent('download');
    await page.getByRole('link', { name: '↓ CSV of this table as filtered' }).click();
    const csvFile = path.join(artifactDir, 'audits-edges.csv');
    await (await csv).saveAs(csvFile);
    expect(readFileSync(csvFile, 'utf8').split('\n').filter(Boolean).length).toBeGreaterThan(17);
    expect(unexpected(errors)).toEqual([]);
    await close();
  });
});

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
    const { page, errors, close } = await as(world.browser, world.server.url, analyst, 'wide');
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
    expect(unexpected(errors)).toEqual([]);
    await close();
  });
});
