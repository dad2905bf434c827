import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadConfig } from '../../server/config.js';
import { launchBrowser, screenshotPath, type TestBrowser } from '../support/browser.js';
import { serveApp, type ServedApp } from '../support/serve-app.js';
import { createStudioWithRoles, type StudioFixture } from '../support/studio-fixture.js';

/**
 * The Billing page in a real browser, against this run's local payment provider: an admin of a
 * fresh studio subscribes with a test card, adds two seats, and sees the new seat count and the
 * prorated line on the next invoice. The provider's webhooks go to this test's app.
 */
let served: ServedApp;
let browser: TestBrowser;
let page: Page;
let studio: StudioFixture;

const seatsText = async () => (await page.getByTestId('billing-seats').textContent())?.trim();

beforeAll(async () => {
  served = await serveApp();
  const res = await fetch(`http://127.0.0.1:${loadConfig().pay.port}/_fake/config`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ webhookUrl: `${served.url}/api/billing/webhook` }),
  });
  expect(res.ok).toBe(true);
  studio = await createStudioWithRoles(served);
  browser = await launchBrowser({ baseURL: served.url });
  page = await browser.newPage();
});

afterAll(async () => {
  await browser?.close();
  await served?.close();
});

describe('billing page', () => {
  it('lets the admin subscribe with a test card', async () => {
    await page.goto('/sign-in?next=%2Fstudio%2Fbilling');
    await page.getByLabel('E-mail').fill(studio.users.admin.email);
    await page.getByLabel('Password').fill(studio.users.admin.password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL('**/studio/billing');
    await page.getByRole('heading', { level: 1, name: 'Billing' }).waitFor();
    expect(await seatsText()).toBe('3 used / 3 paid');
    await page.getByText('No subscription', { exact: true }).waitFor();

    const start = page.getByRole('form', { name: 'Start the subscription' });
    await start.getByLabel('Staff seats').fill('3');
    await start.getByLabel('Card').selectOption('pm_card_visa');
    await start.getByRole('button', { name: 'Subscribe' }).click();
    await page.getByTestId('card-on-file').getByText('4242').waitFor();
    await page.getByText('Paid up', { exact: true }).waitFor();
    const invoices = page.getByRole('table', { name: 'Invoices, newest first' });
    await invoices.getByRole('row').filter({ hasText: 'Paid' }).waitFor();
    expect(await seatsText()).toBe('3 used / 3 paid');
  });

  it('adds two seats and shows the new count and the prorated invoice line', async () => {
    const seats = page.getByRole('form', { name: 'Change seats' });
    await seats.getByRole('button', { name: 'One seat more' }).click();
    await seats.getByRole('button', { name: 'One seat more' }).click();
    await seats.getByRole('button', { name: 'Add 2 seats' }).click();
    await page.getByText('2 seats added.').waitFor();
    expect(await seatsText()).toBe('3 used / 5 paid');

    const next = page.getByRole('list', { name: 'Lines of the next invoice' });
    await next.getByText(/^Remaining time on 5 × /).waitFor();
    await next.getByText(/^Unused time on 3 × /).waitFor();
    expect(await next.getByText('prorated').count()).toBe(2);
    await page.screenshot({ path: screenshotPath('billing-after-two-seats.png'), fullPage: true });

    // The same after a reload: the count comes from the server, not from the form.
    await page.reload();
    await page.getByRole('heading', { level: 1, name: 'Billing' }).waitFor();
    expect(await seatsText()).toBe('3 used / 5 paid');
    expect(browser.problems).toEqual([]);
  });
});
