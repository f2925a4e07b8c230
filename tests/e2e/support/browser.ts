import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { chromium, type Browser, type Page } from 'playwright-core';

export const viewports = {
  phone: { width: 390, height: 844 },
  wide: { width: 1440, height: 900 },
} as const;
export type ViewportName = keyof typeof viewports;

export const artifactDir = path.resolve(__dirname, '../../artifacts');

/**
 * Debian's chromium, headless, with the flags this closed network needs
 * (background networking off, or it keeps dialling out and stalls).
 * Playwright gives every launch a fresh, empty profile of its own.
 */
export async function launchBrowser(): Promise<Browser> {
  const executablePath = process.env.HAIRLINE_CHROMIUM ?? '/usr/bin/chromium';
  return chromium.launch({
    executablePath,
    headless: true,
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
}

export async function screenshot(page: Page, name: string): Promise<string> {
  mkdirSync(artifactDir, { recursive: true });
  const file = path.join(artifactDir, `${name}.png`);
  await page.screenshot({ path: file, fullPage: false });
  return file;
}

/** Collects page errors and console errors so a test can assert there were none. */
export function watchErrors(page: Page): string[] {
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(`pageerror: ${e.message}`));
  page.on('console', (m) => {
    if (m.type() === 'error') errors.push(`console: ${m.text()}`);
  });
  return errors;
}

/** The collected errors less the console lines of refusals (409, 403) a test provokes on purpose. */
export const unexpectedErrors = (errors: string[]) => errors.filter((e) => !/status of (409|403)/.test(e));
