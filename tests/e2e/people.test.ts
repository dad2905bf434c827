import { randomBytes } from 'node:crypto';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser, screenshotPath, type TestBrowser } from '../support/browser.js';
import { serveApp, type ServedApp } from '../support/serve-app.js';
import { mailTo } from '../support/test-app.js';

/**
 * The studio's people page in a real browser: an admin creates a studio through the sign-up
 * page, signs out and in again, invites a cartographer, and the cartographer joins through the
 * e-mailed link and sees no admin navigation. A fresh studio with random e-mails, so the test
 * shares its database with any other test.
 */
const tag = randomBytes(4).toString('hex');
const studioName = `Isoline Studio ${tag}`;
const admin = { name: `Ada Admin ${tag}`, email: `ada.${tag}@e2e.warpmeter.test`, password: 'graticule-over-paper' };
const carto = { name: `Gerard Carto ${tag}`, email: `gerard.${tag}@e2e.warpmeter.test`, password: 'conic-with-two-parallels' };
const editorEmail = `eda.${tag}@e2e.warpmeter.test`;
const lateEmail = `late.${tag}@e2e.warpmeter.test`;

let served: ServedApp;
let adminBrowser: TestBrowser;
let cartoBrowser: TestBrowser;
let page: Page;

const mainNav = (p: Page) => p.getByRole('navigation', { name: 'Main' });
const inviteForm = (p: Page) => p.getByRole('form', { name: 'Invite someone' });
const seatText = async (p: Page) => (await p.getByTestId('seat-usage').textContent())?.trim();

beforeAll(async () => {
  served = await serveApp();
  adminBrowser = await launchBrowser({ baseURL: served.url });
  cartoBrowser = await launchBrowser({ baseURL: served.url });
  page = await adminBrowser.newPage();
});

afterAll(async () => {
  await adminBrowser?.close();
  await cartoBrowser?.close();
  await served?.close();
});

describe('people page', () => {
  it('sends a signed-out visitor to sign-in, and creates a studio through the sign-up page', async () => {
    await page.goto('/projects');
    await page.waitForURL('**/sign-in?next=%2Fprojects');
    await page.getByRole('link', { name: 'Create a studio' }).click();
    await page.waitForURL('**/sign-up');

    // The shared zod schema answers in the browser before anything is sent.
    await page.getByRole('button', { name: 'Create studio' }).click();
    await page.getByText('Enter the studio name.').waitFor();
    expect(await page.getByLabel('Studio name').getAttribute('aria-invalid')).toBe('true');
    await page.screenshot({ path: screenshotPath('sign-up-errors.png') });

    await page.getByLabel('Studio name').fill(studioName);
    await page.getByLabel('Your name').fill(admin.name);
    await page.getByLabel('Work e-mail').fill(admin.email);
    await page.getByLabel('Password').fill(admin.password);
    await page.getByRole('button', { name: 'Create studio' }).click();
    await page.waitForURL('**/projects');
    await page.getByRole('heading', { level: 1, name: 'Projects' }).waitFor();
    expect(await page.getByTestId('current-user').textContent()).toContain(studioName);
    expect(await mainNav(page).getByRole('link').allTextContents()).toEqual(['Projects', 'People', 'Billing']);
  });

  it('signs out and back in as the admin', async () => {
    // On a page slowed to a quarter of its speed, the frame's redirect for an expired session used
    // to overtake the sign-out's own navigation every time, leaving /sign-in?next=%2Fprojects
    // (at full speed now and then). Signing out must land on the plain sign-in page regardless.
    const cdp = await page.context().newCDPSession(page);
    await cdp.send('Emulation.setCPUThrottlingRate', { rate: 4 });
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL('**/sign-in');
    await page.getByRole('button', { name: 'Sign in' }).waitFor();
    await page.waitForLoadState('networkidle');
    await cdp.send('Emulation.setCPUThrottlingRate', { rate: 1 });
    await cdp.detach();
    expect(new URL(page.url()).pathname + new URL(page.url()).search).toBe('/sign-in');

    await page.goto('/studio/people');
    await page.waitForURL('**/sign-in?next=%2Fstudio%2Fpeople');
    await page.getByLabel('E-mail').fill(admin.email);
    await page.getByLabel('Password').fill('not-the-password');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('alert').waitFor();
    await page.getByLabel('Password').fill(admin.password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL('**/studio/people');
    await page.getByRole('heading', { level: 1, name: 'People' }).waitFor();
    expect(await seatText(page)).toBe('1 of 3 staff seats');
    expect(await page.title()).toBe('People · Warpmeter');
  });

  it('checks the invitation beside its field, sends it, and lists it as pending', async () => {
    const form = inviteForm(page);
    await form.getByLabel('E-mail').fill('not-an-address');
    await form.getByRole('button', { name: 'Send invitation' }).click();
    await form.getByText('Enter a valid e-mail address.').waitFor();
    expect(await form.getByLabel('E-mail').getAttribute('aria-invalid')).toBe('true');

    await form.getByLabel('E-mail').fill(carto.email);
    await form.getByLabel('Role').selectOption('cartographer');
    await form.getByRole('button', { name: 'Send invitation' }).click();

    const pending = page.getByRole('region', { name: 'Pending invitations' });
    const row = pending.getByRole('row').filter({ hasText: carto.email });
    await row.waitFor();
    expect(await row.textContent()).toContain('Cartographer');
    expect(await seatText(page)).toBe('2 of 3 staff seats');
    expect(await form.getByLabel('E-mail').inputValue()).toBe('');
    await page.screenshot({ path: screenshotPath('people-admin.png'), fullPage: true });
  });

  it('lets the invited cartographer join from the e-mail, without any admin navigation', async () => {
    const mail = await mailTo(carto.email);
    const link = /https?:\/\/\S+\/accept-invite\?token=[^\s"<>]+/.exec(mail.text)?.[0];
    expect(link, 'the invitation e-mail carries an accept link').toBeTruthy();
    const { pathname, search } = new URL(link!);

    const cp = await cartoBrowser.newPage();
    await cp.goto(pathname + search);
    await cp.getByRole('heading', { level: 1, name: `Join ${studioName}` }).waitFor();
    await cp.getByLabel('Your name').fill(carto.name);
    await cp.getByLabel('Choose a password').fill(carto.password);
    await cp.getByRole('button', { name: `Join ${studioName}` }).click();
    await cp.waitForURL('**/projects');
    await mainNav(cp).getByRole('link', { name: 'Projects' }).waitFor();
    expect(await mainNav(cp).getByRole('link').allTextContents()).toEqual(['Projects']);
    expect(await cp.getByText('Cartographer', { exact: true }).count()).toBe(1);

    // The page itself is refused too, not only hidden from the navigation.
    await cp.goto('/studio/people');
    await cp.getByText('Not available to your role').waitFor();
    await cp.screenshot({ path: screenshotPath('people-cartographer-refused.png') });
  });

  it('shows the seat-limit refusal clearly and frees the seat when an invitation is revoked', async () => {
    await page.reload();
    const members = page.getByRole('region', { name: 'Members' });
    await members.getByRole('row').filter({ hasText: carto.email }).waitFor();
    expect(await seatText(page)).toBe('2 of 3 staff seats');

    const form = inviteForm(page);
    await form.getByLabel('E-mail').fill(editorEmail);
    await form.getByLabel('Role').selectOption('editor');
    await form.getByRole('button', { name: 'Send invitation' }).click();
    const pending = page.getByRole('region', { name: 'Pending invitations' });
    await pending.getByRole('row').filter({ hasText: editorEmail }).waitFor();
    expect(await seatText(page)).toBe('3 of 3 staff seats');

    await form.getByLabel('E-mail').fill(lateEmail);
    await form.getByLabel('Role').selectOption('cartographer');
    await form.getByRole('button', { name: 'Send invitation' }).click();
    const refusal = form.getByRole('alert').filter({ hasText: 'The invitation was not sent' });
    await refusal.waitFor();
    expect(await refusal.textContent()).toContain('All 3 staff seats are in use');
    expect(await pending.getByRole('row').filter({ hasText: lateEmail }).count()).toBe(0);
    await page.screenshot({ path: screenshotPath('people-seats-full.png'), fullPage: true });

    await pending.getByRole('button', { name: `Revoke the invitation to ${editorEmail}` }).click();
    await pending.getByRole('row').filter({ hasText: editorEmail }).waitFor({ state: 'detached' });
    expect(await seatText(page)).toBe('2 of 3 staff seats');
  });

  it('sorts the members table from its column headers', async () => {
    const members = page.getByRole('region', { name: 'Members' });
    const nameHeader = members.getByRole('columnheader', { name: 'Name' });
    const firstCells = async () => members.getByRole('rowheader').allTextContents();
    expect(await nameHeader.getAttribute('aria-sort')).toBe('ascending');
    expect((await firstCells())[0]).toContain('Ada Admin');
    // Keyboard: the header is a button reached by focus and pressed with Enter.
    await nameHeader.getByRole('button').focus();
    await page.keyboard.press('Enter');
    expect(await nameHeader.getAttribute('aria-sort')).toBe('descending');
    expect((await firstCells())[0]).toContain('Gerard Carto');
  });

  it('changes a role in place, and a deactivated member is signed out at their next page', async () => {
    const members = page.getByRole('region', { name: 'Members' });
    const roleSelect = members.getByLabel(`Role of ${carto.name}`);
    await roleSelect.selectOption('editor');
    await page.getByText(`${carto.name} is now Editor.`).waitFor();
    expect(await roleSelect.inputValue()).toBe('editor');

    const cartoRow = members.getByRole('row').filter({ hasText: carto.email });
    await members.getByRole('button', { name: `Deactivate ${carto.name}` }).click();
    await cartoRow.getByText('Deactivated', { exact: true }).waitFor();
    expect(await seatText(page)).toBe('1 of 3 staff seats');

    const cp = cartoBrowser.context.pages()[0];
    await cp.goto('/projects');
    await cp.waitForURL('**/sign-in?next=%2Fprojects');

    await members.getByRole('button', { name: `Reactivate ${carto.name}` }).click();
    await cartoRow.getByText('Active', { exact: true }).waitFor();
    expect(await seatText(page)).toBe('2 of 3 staff seats');
  });

  it('fits a phone screen: wide tables scroll inside their card, not the page', async () => {
    await page.setViewportSize({ width: 390, height: 844 });
    await page.getByRole('region', { name: 'Members' }).waitFor();
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await page.screenshot({ path: screenshotPath('people-phone.png'), fullPage: true });
    await page.setViewportSize({ width: 1280, height: 860 });
  });

  it('met no script errors on the way', () => {
    expect(adminBrowser.problems).toEqual([]);
    expect(cartoBrowser.problems).toEqual([]);
    if (process.env.WARPMETER_SHOW_WARNINGS) console.log([...adminBrowser.warnings, ...cartoBrowser.warnings]);
  });
});
