import { mkdtempSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { randomNetwork } from '../../lib/spectral';
import { demoUser } from '../../seeds/data/demo';
import { screenshot, viewports, watchErrors, type ViewportName } from './support/browser';
import { useBrowserWorld } from './support/world';
import { signInAs } from './support/sign-in';

jest.setTimeout(240_000);

const analyst = demoUser('analyst');
const tmp = mkdtempSync(path.join(os.tmpdir(), 'hairline-e2e-files-'));
const demoCsv = path.resolve(__dirname, '../../seeds/data/marrow-fen-microgrid.csv');

function writeCsv(name: string, rows: string[]): string {
  const file = path.join(tmp, name);
  writeFileSync(file, ['source,target,weight', ...rows].join('\n'));
  return file;
}

async function openImport(page: Page, baseUrl: string) {
  await page.goto(baseUrl + '/networks', { waitUntil: 'networkidle' });
  await page.getByRole('button', { name: 'Import a network' }).click();
  await page.getByRole('heading', { name: 'Import a network' }).waitFor();
}

async function chooseFile(page: Page, file: string) {
  const chooser = page.waitForEvent('filechooser');
  await page.getByRole('button', { name: /Choose (a|another) file/ }).click();
  await (await chooser).setFiles(file);
  await page.getByText(path.basename(file), { exact: false }).waitFor();
}

/**
 * Import as an analyst would: a broken file first (every problem listed with
 * its line, nothing stored), then a good one, landing on the detail screen
 * with its summary, spectrum and drawing.
 */
describe('network import and detail in Chromium', () => {
  const world = useBrowserWorld();

  for (const size of Object.keys(viewports) as ViewportName[]) {
    test(`refused file, then an accepted one, at ${size}`, async () => {
      const page = await world.browser.newPage({ viewport: viewports[size] });
      const errors = watchErrors(page);
      await signInAs(page, world.server.url, analyst.email, analyst.password);
      await openImport(page, world.server.url);

      await page.getByLabel('Name', { exact: true }).fill(`Fen copy ${size}`);
      await chooseFile(page, writeCsv(`broken-${size}.csv`, ['inv-a,inv-b,1', 'inv-b,inv-c,heavy', 'inv-c,inv-c,1', 'inv-a,inv-b,2']));
      await page.getByRole('button', { name: 'Import network' }).click();
      const alert = page.getByRole('alert', { name: 'Import problems' });
      await alert.waitFor();
      await expect(alert.getByText(/^line 3:.*not a number/).isVisible()).resolves.toBe(true);
      await expect(alert.getByText(/^line 4:/).isVisible()).resolves.toBe(true);
      await expect(alert.getByText(/^line 5:.*line 2|^line 2.*line 5/).isVisible()).resolves.toBe(true);
      await expect(alert.getByText(/Nothing was stored/).isVisible()).resolves.toBe(true);
      await screenshot(page, `networks-import-errors-${size}`);

      await chooseFile(page, demoCsv);
      await page.getByRole('button', { name: 'Import network' }).click();
      await page.getByRole('heading', { name: `Fen copy ${size}` }).waitFor();
      // The spectrum is computed in the background; the page polls until it lands.
      await page.getByLabel(/Spectrum plot of 8 eigenvalues/).waitFor({ timeout: 90_000 });
      await page.getByText('spectrum ready').first().waitFor();
      await page.getByLabel(/Drawing of 8 nodes and 14 edges/).waitFor();
      await screenshot(page, `networks-detail-${size}`);
      if (size === 'phone') {
        const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
        expect(overflow).toBeLessThanOrEqual(0);
      }
      expect(errors.filter((e) => !e.includes('422'))).toEqual([]);
      await page.close();
    });
  }

  test('a 2,000-node, 20,000-edge file imports and its detail screen renders', async () => {
    const net = randomNetwork({ nodes: 2000, edgesPerNode: 10, seed: 2026 });
    expect(net.edges.length).toBeGreaterThanOrEqual(19_000);
    const file = writeCsv('large.csv', net.edges.slice(0, 20_000).map((e) => `${e.source},${e.target},${e.weight}`));
    const page = await world.browser.newPage({ viewport: viewports.wide });
    await signInAs(page, world.server.url, analyst.email, analyst.password);
    await openImport(page, world.server.url);
    await page.getByLabel('Name', { exact: true }).fill('Large grid');
    await chooseFile(page, file);
    const started = Date.now();
    await page.getByRole('button', { name: 'Import network' }).click();
    await page.getByRole('heading', { name: 'Large grid' }).waitFor({ timeout: 120_000 });
    await page.getByText(/more than a drawing can show legibly/).waitFor();
    const seconds = (Date.now() - started) / 1000;
    // A figure for the notes, not a timed assertion.
    console.log(`large import: ${net.nodes.length} nodes, ${Math.min(20_000, net.edges.length)} edges, upload to rendered detail ${seconds.toFixed(1)} s`);
    await screenshot(page, 'networks-detail-large-wide');
    await page.close();
  });
});
