import type { Page } from 'playwright-core';

/** Signs in through the real sign-in page, as a person would, and waits for the overview. */
export async function signInAs(page: Page, baseUrl: string, email: string, password: string): Promise<void> {
  await page.goto(baseUrl + '/sign-in', { waitUntil: 'networkidle' });
  await page.getByLabel('E-mail', { exact: true }).fill(email);
  await page.getByLabel('Password', { exact: true }).fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('heading', { name: 'Overview' }).waitFor();
}
