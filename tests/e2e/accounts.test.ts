import { demoUser } from '../../seeds/data/demo';
import { screenshot, viewports, watchErrors } from './support/browser';
import { useBrowserWorld } from './support/world';
import { signInAs } from './support/sign-in';

jest.setTimeout(180_000);

const admin = demoUser('admin');

/**
 * The invitation walk-through on a phone, as a new user would try it: the
 * admin invites an auditor, the message lands in the outbox, its link sets a
 * password, and the auditor signs in to a menu and pages without admin.
 */
describe('accounts in Chromium', () => {
  const world = useBrowserWorld();

  test('an anonymous visitor of a signed-in page is sent to sign-in', async () => {
    const page = await world.browser.newPage({ viewport: viewports.phone });
    await page.goto(world.server.url + '/networks', { waitUntil: 'networkidle' });
    await page.getByRole('heading', { name: 'Sign in' }).waitFor();
    expect(new URL(page.url()).pathname).toBe('/sign-in');
    await page.getByLabel('E-mail', { exact: true }).fill(admin.email);
    await page.getByLabel('Password', { exact: true }).fill('a wrong password');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByText('That e-mail and password do not match an active account.').waitFor();
    await screenshot(page, 'accounts-sign-in-refused-phone');
    await page.close();
  });

  test('admin invites an auditor; the outbox link sets a password; the auditor sees only auditor things', async () => {
    const context = await world.browser.newContext({ viewport: viewports.phone });
    const page = await context.newPage();
    const errors = watchErrors(page);
    await signInAs(page, world.server.url, admin.email, admin.password);
    await expect(page.getByRole('link', { name: 'Admin' }).isVisible()).resolves.toBe(true);

    await page.getByRole('link', { name: 'Admin' }).click();
    await page.getByRole('heading', { name: 'People' }).waitFor();
    await page.getByLabel('E-mail address', { exact: true }).fill('tamsin.reed@gannet-sound.test');
    await page.getByLabel('Name', { exact: true }).fill('Tamsin Reed');
    await page.getByRole('checkbox', { name: 'Roles: auditor' }).click();
    await page.getByRole('button', { name: 'Send invitation' }).click();
    await page.getByText('Invitation sent to tamsin.reed@gannet-sound.test').waitFor();
    await page.getByText('○ invited').first().waitFor();
    await screenshot(page, 'accounts-admin-invited-phone');

    await page.getByRole('link', { name: 'Outbox' }).click();
    await page.getByRole('heading', { name: 'Outbox' }).waitFor();
    await page.getByText('Hairline: you have been invited').waitFor();
    await page.getByText('To tamsin.reed@gannet-sound.test').waitFor();
    await screenshot(page, 'accounts-outbox-phone');
    await page.getByRole('link', { name: 'Open the link for tamsin.reed@gannet-sound.test' }).click();

    await page.getByRole('heading', { name: 'Accept your invitation' }).waitFor();
    expect(new URL(page.url()).pathname).toBe('/invitation');
    await page.getByLabel('New password', { exact: true }).fill('kelp-bed-survey-0419');
    await page.getByLabel('Repeat the password', { exact: true }).fill('kelp-bed-survey-0419');
    await page.getByRole('button', { name: 'Set password' }).click();
    await page.getByText('Your password for tamsin.reed@gannet-sound.test is set.').waitFor();
    await screenshot(page, 'accounts-invitation-accepted-phone');

    // The auditor, in a browser of their own.
    const auditorContext = await world.browser.newContext({ viewport: viewports.phone });
    const auditor = await auditorContext.newPage();
    const auditorErrors = watchErrors(auditor);
    await signInAs(auditor, world.server.url, 'tamsin.reed@gannet-sound.test', 'kelp-bed-survey-0419');
    const nav = auditor.getByTestId('bottom-bar');
    await nav.getByRole('link', { name: 'Audits' }).waitFor();
    expect(await nav.getByRole('link').allTextContents()).toEqual(['Overview', 'Networks', 'Audits', 'Account', 'Help']);
    await screenshot(auditor, 'accounts-auditor-overview-phone');

    await auditor.getByRole('link', { name: 'Account' }).click();
    await auditor.getByText('Roles: auditor').waitFor();
    expect(await auditor.getByText('API tokens').count()).toBe(0);

    await auditor.goto(world.server.url + '/admin', { waitUntil: 'networkidle' });
    await auditor.getByText('This needs the admin role; your account does not hold it.').waitFor();
    await auditor.goto(world.server.url + '/admin/outbox', { waitUntil: 'networkidle' });
    await auditor.getByText('This needs the admin role; your account does not hold it.').waitFor();
    expect(await auditor.getByText('Hairline: you have been invited').count()).toBe(0);
    await screenshot(auditor, 'accounts-auditor-refused-admin-phone');

    // 403s from the API are the expected refusals here; anything else is a fault.
    const unexpected = (list: string[]) => list.filter((e) => !/status of 40[13]/.test(e));
    expect(unexpected(errors)).toEqual([]);
    expect(unexpected(auditorErrors)).toEqual([]);
    await context.close();
    await auditorContext.close();
  });

  test('the admin screen on a wide screen', async () => {
    const page = await world.browser.newPage({ viewport: viewports.wide });
    await signInAs(page, world.server.url, admin.email, admin.password);
    await page.goto(world.server.url + '/admin', { waitUntil: 'networkidle' });
    await page.getByText('Everyone (').waitFor();
    await expect(page.getByTestId('side-rail').getByRole('link', { name: 'Admin' }).isVisible()).resolves.toBe(true);
    await screenshot(page, 'accounts-admin-wide');
    await page.close();
  });
});
