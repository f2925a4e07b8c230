import { execFileSync } from 'node:child_process';
import { existsSync, readFileSync } from 'node:fs';
import path from 'node:path';
import type { Page } from 'playwright-core';
import { demoUser } from '../../seeds/data/demo';
import { unnamedControls } from './support/accessible-names';
import { artifactDir, screenshot, unexpectedErrors, viewports, type ViewportName } from './support/browser';
import { signedInContext } from './support/sign-in';
import { useBrowserWorld } from './support/world';

jest.setTimeout(300_000);

const analyst = demoUser('analyst');
const auditor = demoUser('auditor');
const approver = demoUser('approver');
const demoCsv = path.resolve(__dirname, '../../seeds/data/gannet-sound-buoy-relay.csv');

/** What a person on this screen meets: no nameless control, no sideways scrolling on a phone; then a picture. */
async function step(page: Page, size: ViewportName, name: string) {
  await page.waitForLoadState('networkidle');
  expect(await unnamedControls(page)).toEqual([]);
  if (size === 'phone') {
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow).toBeLessThanOrEqual(0);
  }
  await screenshot(page, `job-${size}-${name}`);
}

/**
 * Keeps every value the sweep's progress bar shows, from before the audit's
 * page opens until the test reads them, so the bar is watched as a person
 * would, not sampled by luck between polls.
 */
async function watchProgressBars(page: Page): Promise<() => Promise<{ done: number; total: number }[]>> {
  await page.evaluate(() => {
    const seen: { done: number; total: number }[] = [];
    (window as unknown as { progressSeen: typeof seen }).progressSeen = seen;
    const look = () => {
      const bar = document.querySelector('[role="progressbar"][aria-label$="edges swept"]');
      if (!bar) return;
      const now = { done: Number(bar.getAttribute('aria-valuenow')), total: Number(bar.getAttribute('aria-valuemax')) };
      const last = seen[seen.length - 1];
      if (!last || last.done !== now.done || last.total !== now.total) seen.push(now);
    };
    new MutationObserver(look).observe(document.body, { subtree: true, childList: true, attributes: true });
  });
  return () => page.evaluate(() => (window as unknown as { progressSeen: { done: number; total: number }[] }).progressSeen);
}

const rootType = /square-root|cube-root/;

/**
 * The whole job with four separate accounts, once at phone size and once on
 * a wide screen: the analyst imports the demo relay CSV through the upload
 * form, starts an audit and watches its bar finish; the auditor narrows the
 * table to root-type edges, reads an edge's response plot, disposes every
 * flagged edge and submits; the approver, on a 390×844 phone in both runs,
 * reads the summary and seals with a comment; then an edit is refused and
 * the PDF report downloads. Every step is checked for nameless controls and
 * sideways scrolling and kept as a screenshot (tests/artifacts/job-*).
 */
describe('the whole job in Chromium', () => {
  const world = useBrowserWorld();

  for (const size of ['phone', 'wide'] as const) {
    describe(`at ${size} (${viewports[size].width}×${viewports[size].height})`, () => {
      const networkName = `Gannet relay recheck ${size}`;
      let auditPath = '';
      let flaggedCount = 0;

      test('analyst imports the demo CSV through the upload form, starts an audit and watches the sweep finish', async () => {
        const { page, errors, close } = await signedInContext(world.browser, world.server.url, analyst, size);
        await page.goto(world.server.url + '/networks', { waitUntil: 'networkidle' });
        await page.getByRole('button', { name: 'Import a network' }).click();
        await page.getByRole('heading', { name: 'Import a network' }).waitFor();
        await page.getByLabel('Name', { exact: true }).fill(networkName);
        const chooser = page.waitForEvent('filechooser');
        await page.getByRole('button', { name: /Choose (a|another) file/ }).click();
        await (await chooser).setFiles(demoCsv);
        await page.getByText(path.basename(demoCsv)).waitFor();
        await step(page, size, '01-import-form');

        await page.getByRole('button', { name: 'Import network' }).click();
        await page.getByRole('heading', { name: networkName }).waitFor();
        await page.getByLabel(/Spectrum plot of 10 eigenvalues/).waitFor({ timeout: 90_000 });
        await page.getByText('spectrum ready').first().waitFor();
        await step(page, size, '02-imported');

        await page.getByRole('button', { name: 'Start an audit' }).click({ timeout: 60_000 });
        await page.getByRole('heading', { name: 'Start an audit' }).waitFor();
        await page.getByText(/17 edges × 11 rungs × 2 signs/).waitFor();
        await step(page, size, '03-start-form');

        const progressSeen = await watchProgressBars(page);
        await page.getByRole('button', { name: 'Start the sweep' }).click();
        await page.waitForURL(/\/audits\/\d+$/);
        auditPath = new URL(page.url()).pathname;
        if (await page.getByRole('progressbar', { name: /edges swept/ }).isVisible()) await screenshot(page, `job-${size}-04-sweeping`);
        await page.getByText('in review', { exact: true }).first().waitFor({ timeout: 90_000 });
        await page.getByRole('list', { name: 'Edges per class' }).waitFor();
        await page.getByText('sweep finished; ready for review').waitFor();

        // The bar was on screen from the start, only ever moved forward, and is gone now the sweep is done.
        const seen = await progressSeen();
        expect(seen.length).toBeGreaterThan(0);
        expect(seen[0]).toEqual({ done: 0, total: 17 });
        for (let i = 1; i < seen.length; i++) expect(seen[i].done).toBeGreaterThanOrEqual(seen[i - 1].done);
        await expect(page.getByRole('progressbar', { name: /edges swept/ }).count()).resolves.toBe(0);
        await page.getByText(/do not replace it, nor the codes and standards/).waitFor();
        // The analyst who ran it may look, but neither dispose nor submit.
        await expect(page.getByRole('button', { name: 'Submit for sign-off' }).count()).resolves.toBe(0);
        await step(page, size, '05-swept');
        expect(unexpectedErrors(errors)).toEqual([]);
        await close();
      });

      test('auditor filters to root-type edges, reads a response plot, disposes every flagged edge and submits', async () => {
        const { page, errors, close } = await signedInContext(world.browser, world.server.url, auditor, size);
        // From the overview's next step, as a first-time auditor would.
        await page.getByRole('link', { name: /^Audits ready for review/ }).first().click();
        await page.getByRole('heading', { name: 'Audits' }).waitFor();
        await page.getByRole('link', { name: new RegExp(`^Audit ${auditPath.split('/').pop()}: ${networkName}`) }).click();
        await page.getByRole('heading', { name: networkName }).waitFor();

        if (size === 'phone') await page.getByRole('button', { name: 'Filters and sort' }).click();
        await page.getByRole('checkbox', { name: 'square-root' }).click();
        await page.getByRole('checkbox', { name: 'cube-root' }).click();
        await page.waitForURL(/class=square-root(%2C|,)cube-root/);
        // Rows in the wide table, cards on a phone: the same accessible names either way.
        const edgeItems = size === 'wide' ? page.getByRole('table', { name: 'Edges' }).getByRole('row', { name: /^Edge \d+:/ }) : page.getByRole('link', { name: /^Edge \d+:/ });
        await page.waitForFunction((rx) => {
          const names = Array.from(document.querySelectorAll('[aria-label^="Edge "]')).map((r) => r.getAttribute('aria-label') ?? '');
          return names.length > 0 && names.every((n) => new RegExp(rx).test(n));
        }, rootType.source);
        const rootCount = await edgeItems.count();
        expect(rootCount).toBeGreaterThan(0);

        // The narrowed view lives in the URL: a reload (or a shared link) keeps it.
        await page.goto(page.url(), { waitUntil: 'networkidle' });
        if (size === 'phone') await page.getByRole('button', { name: 'Filters and sort' }).click();
        await expect(page.getByRole('checkbox', { name: 'cube-root' }).getAttribute('aria-checked')).resolves.toBe('true');
        await expect(edgeItems.count()).resolves.toBe(rootCount);
        if (size === 'wide') await page.getByRole('table', { name: 'Edges' }).getByRole('columnheader', { name: 'Sort by tolerance |ε|' }).click();
        else await page.getByRole('radio', { name: 'tolerance', exact: true }).click();
        await page.waitForURL(/sort=tolerance/);
        await step(page, size, '06-root-type-edges');

        // The tightest edge's response plot: beside the table on a wide screen, on its own page on a phone.
        await edgeItems.first().click();
        const detail = size === 'wide' ? page.getByRole('complementary', { name: 'Selected edge' }) : page.locator('main');
        await detail.getByLabel(/^Response plot: \d+ points, \d+ used in the fit, [12] fitted lines?/).waitFor();
        await detail.getByText('Tolerance', { exact: true }).waitFor();
        await step(page, size, '07-edge-plot');
        if (size === 'phone') await page.getByRole('button', { name: '‹ Back to the audit' }).click();
        else await detail.getByRole('button', { name: 'Close' }).click();

        // Every flagged edge still without a disposition, one after another.
        await page.goto(`${world.server.url}${auditPath}?flagged=yes&disposition=none`, { waitUntil: 'networkidle' });
        const kinds = ['✓ accept', '△ mitigate', '◎ monitor'];
        for (; flaggedCount < 20; flaggedCount++) {
          await page.waitForLoadState('networkidle');
          if ((await page.getByText('No edge matches').count()) > 0) break;
          const item = edgeItems.first();
          await item.waitFor();
          const label = (await item.getAttribute('aria-label')) ?? '';
          await item.click();
          const form = size === 'wide' ? page.getByRole('complementary', { name: 'Selected edge' }) : page.locator('main');
          await form.getByRole('heading', { name: label.replace(/^Edge \d+: /, '').replace(/, [a-z-]+$/, '') }).waitFor();
          await form.getByRole('radio', { name: kinds[flaggedCount % 3] }).click();
          await form.getByLabel('Note', { exact: true }).fill(`Checked ${label.split(':')[0].toLowerCase()} against the relay commissioning sheet.`);
          if (flaggedCount === 0) await step(page, size, '08-disposition-form');
          await form.getByRole('button', { name: 'Record disposition' }).click();
          await form.getByText('● Saved').waitFor();
          if (size === 'phone') await page.getByRole('button', { name: '‹ Back to the audit' }).click();
          await page.getByRole(size === 'wide' ? 'row' : 'link', { name: label, exact: true }).waitFor({ state: 'detached' });
        }
        expect(flaggedCount).toBeGreaterThanOrEqual(rootCount);
        await page.getByText('No edge matches').waitFor();

        await page.getByRole('button', { name: 'Submit for sign-off' }).click();
        await page.getByLabel('Comment (optional)').fill('All root-type edges reviewed; the crest links need watching in service.');
        await page.getByRole('button', { name: 'Submit for sign-off' }).click();
        await page.getByText('awaiting sign-off', { exact: true }).first().waitFor();
        await step(page, size, '09-submitted');
        expect(unexpectedErrors(errors)).toEqual([]);
        await close();
      });

      test('approver on a 390×844 phone reads the summary and seals the audit with a comment', async () => {
        const { page, errors, close } = await signedInContext(world.browser, world.server.url, approver, 'phone');
        await page.getByTestId('bottom-bar').getByRole('link', { name: 'Audits' }).click();
        await page.getByRole('heading', { name: 'Audits' }).waitFor();
        await page.getByRole('checkbox', { name: 'awaiting sign-off' }).click();
        await page.waitForURL(/state=awaiting-sign-off/);
        const card = page.getByRole('link', { name: new RegExp(`^Audit ${auditPath.split('/').pop()}: ${networkName}`) });
        await card.getByText(/^0\s*without disposition$/).waitFor();
        await step(page, 'phone', `10-approver-list-${size}-run`);
        await card.click();
        await page.waitForURL(new RegExp(`${auditPath}$`));

        // The summary an approver signs: classes counted, every flagged edge disposed, the auditor's comment.
        const classes = page.getByRole('list', { name: 'Edges per class' });
        await classes.waitFor();
        await expect(classes.getByText(/cube-root/).count()).resolves.toBeGreaterThan(0);
        await page.getByText(/the crest links need watching in service/).first().waitFor();
        await step(page, 'phone', `11-approver-summary-${size}-run`);

        await page.getByRole('button', { name: 'Seal the audit…' }).click();
        await page.getByText(/It is irreversible/).waitFor();
        await page.getByRole('button', { name: 'Continue to confirmation' }).click();
        await page.getByText('× a comment is required').waitFor();
        await page.getByLabel('Comment (required)').fill('Approved for the spring retune; calibrate the crest links quarterly.');
        await page.getByRole('button', { name: 'Continue to confirmation' }).click();
        await page.getByRole('alert', { name: 'Confirm sealing' }).waitFor();
        await step(page, 'phone', `12-seal-confirm-${size}-run`);
        await page.getByRole('button', { name: 'Seal it — this cannot be undone' }).click();
        await page.getByText(/it matches\. Nothing has changed since sealing/).waitFor();
        await page.getByText('sealed the audit (approved)').waitFor();
        await page.getByText(/The hash chain verifies/).waitFor();
        await page.getByText(/SHA-256 over the results/).scrollIntoViewIfNeeded();
        await step(page, 'phone', `13-sealed-${size}-run`);
        expect(unexpectedErrors(errors)).toEqual([]);
        await close();
      });

      test('after sealing an edit is refused and the PDF report downloads', async () => {
        const { page, errors, close } = await signedInContext(world.browser, world.server.url, auditor, size);
        await page.goto(world.server.url + auditPath, { waitUntil: 'networkidle' });
        await page.getByText('sealed', { exact: true }).first().waitFor();
        const auditId = auditPath.split('/').pop();

        // The screen offers no form any more …
        const anyEdge = size === 'wide' ? page.getByRole('row', { name: /^Edge \d+:/ }) : page.getByRole('link', { name: /^Edge \d+:/ });
        await anyEdge.first().click();
        const detail = size === 'wide' ? page.getByRole('complementary', { name: 'Selected edge' }) : page.locator('main');
        await detail.getByLabel(/^Response plot:/).waitFor();
        await expect(detail.getByRole('button', { name: /disposition/ }).count()).resolves.toBe(0);
        await expect(detail.getByRole('radio', { name: /accept/ }).count()).resolves.toBe(0);
        // … and a change sent anyway is refused by the server.
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
        await step(page, size, '14-sealed-edit-refused');
        if (size === 'phone') await page.getByRole('button', { name: '‹ Back to the audit' }).click();

        const download = page.waitForEvent('download');
        await page.getByRole('link', { name: '↓ PDF sign-off report' }).click();
        const file = path.join(artifactDir, `job-${size}-15-report.pdf`);
        await (await download).saveAs(file);
        const pdf = readFileSync(file);
        expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');
        expect(pdf.length).toBeGreaterThan(2000);
        if (existsSync('/usr/bin/pdftoppm')) {
          const png = path.join(artifactDir, `job-${size}-15-report-page1`);
          execFileSync('/usr/bin/pdftoppm', ['-png', '-r', '60', '-f', '1', '-l', '1', '-singlefile', file, png]);
          expect(existsSync(`${png}.png`)).toBe(true);
        }

        const csv = page.waitForEvent('download');
        await page.getByRole('link', { name: '↓ CSV of this table as filtered' }).click();
        const csvFile = path.join(artifactDir, `job-${size}-16-edges.csv`);
        await (await csv).saveAs(csvFile);
        const lines = readFileSync(csvFile, 'utf8').split('\n').filter(Boolean);
        expect(lines.length).toBe(1 + 17);
        expect(lines.filter((l) => /,yes,(accept|mitigate|monitor),/.test(l)).length).toBe(flaggedCount);
        expect(unexpectedErrors(errors)).toEqual([]);
        await close();
      });
    });
  }
});
