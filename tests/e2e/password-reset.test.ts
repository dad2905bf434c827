import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser, screenshotPath, type TestBrowser } from '../support/browser.js';
import { serveApp, type ServedApp } from '../support/serve-app.js';
import { createStudioWithRoles, type StudioFixture } from '../support/studio-fixture.js';
import { mailTo } from '../support/test-app.js';

/** Forgotten password, end to end in the browser: request, e-mailed link, new password, sign-in. */
let served: ServedApp;
let browser: TestBrowser;
let studio: StudioFixture;
let page: Page;

beforeAll(async () => {
  served = await serveApp();
  studio = await createStudioWithRoles(served);
  browser = await launchBrowser({ baseURL: served.url });
  page = await browser.newPage();
});

afterAll(async () => {
  await browser?.close();
  await served?.close();
});

describe('password reset', () => {
  it('sends a link, sets a new password through it, and the new password signs in', async () => {
    const { email, password: oldPassword } = studio.users.editor;
    const newPassword = 'azimuthal-equidistant-from-home';

    await page.goto('/sign-in');
    await page.getByRole('link', { name: 'Forgot your password?' }).click();
    await page.waitForURL('**/reset-password');
    await page.getByLabel('E-mail').fill(email);
    await page.getByRole('button', { name: 'Send reset link' }).click();
    await page.getByText('Check your inbox').waitFor();

    const mail = await mailTo(email);
    const link = /https?:\/\/\S+\/reset-password\?token=[^\s"<>]+/.exec(mail.text)?.[0];
    expect(link, 'the reset e-mail carries a link').toBeTruthy();
    const { pathname, search } = new URL(link!);

    await page.goto(pathname + search);
    await page.getByText(`For ${email}.`).waitFor();
    await page.getByLabel('New password').fill('short');
    await page.getByRole('button', { name: 'Set new password' }).click();
    await page.getByText('Use at least 10 characters.').waitFor();
    await page.getByLabel('New password').fill(newPassword);
    await page.getByRole('button', { name: 'Set new password' }).click();
    await page.getByText('Password changed').waitFor();

    // The link works once.
    await page.goto(pathname + search);
    await page.getByText('Reset link not usable').waitFor();
    await page.screenshot({ path: screenshotPath('reset-link-used.png') });

    await page.goto('/sign-in');
    await page.getByLabel('E-mail').fill(email);
    await page.getByLabel('Password').fill(oldPassword);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('alert').waitFor();
    await page.getByLabel('Password').fill(newPassword);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL('**/projects');
    expect(await page.getByTestId('current-user').textContent()).toContain(studio.users.editor.name);
    expect(browser.problems).toEqual([]);
  });
});
