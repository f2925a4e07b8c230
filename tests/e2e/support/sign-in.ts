import type { Browser, Page } from 'playwright-core';
import { viewports, watchErrors, type ViewportName } from './browser';

/** Signs in through the real sign-in page, as a person would, and waits for the overview. */
export async function signInAs(page: Page, baseUrl: string, email: string, password: string): Promise<void> {
  await page.goto(baseUrl + '/sign-in', { waitUntil: 'networkidle' });
  await page.getByLabel('E-mail', { exact: true }).fill(email);
  await page.getByLabel('Password', { exact: true }).fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('heading', { name: 'Overview' }).waitFor();
}

/**
 * A fresh browser context (own cookies, downloads allowed) at `size`, signed in
 * as `who`, with its page errors collected; `close` ends the context.
 */
export async function signedInContext(browser: Browser, baseUrl: string, who: { email: string; password: string }, size: ViewportName) {
  const context = await browser.newContext({ viewport: viewports[size], acceptDownloads: true });
  const page = await context.newPage();
  const errors = watchErrors(page);
  await signInAs(page, baseUrl, who.email, who.password);
  return { page, errors, close: () => context.close() };
}
