import { randomBytes } from 'node:crypto';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SignOff } from '../../server/entities/index.js';
import { launchBrowser, screenshotPath, type TestBrowser } from '../support/browser.js';
import { serveApp, type ServedApp } from '../support/serve-app.js';
import { engineScore, seedAuditedProject, type AuditedProject } from '../support/signoff-fixture.js';
import { createStudioWithRoles, type StudioFixture } from '../support/studio-fixture.js';
import { mailTo } from '../support/test-app.js';

/**
 * Sign-off in a real browser: the editor shortlists two candidates on the project's Review tab
 * and sends them to a reviewer with no account; the reviewer follows the e-mailed link, chooses a
 * password, opens the compare view of the shortlist, and approves one candidate with their typed
 * name; the editor then sees the approval, its record hash and the project's history.
 */
const tag = randomBytes(4).toString('hex');
const reviewer = { name: `Rosa Reviewer ${tag}`, email: `rosa.${tag}@client.e2e.warpmeter.test`, password: 'equal-area-or-nothing' };

let served: ServedApp;
let s: StudioFixture;
let p: AuditedProject;
let reviewerBrowser: TestBrowser;
let editorBrowser: TestBrowser;

beforeAll(async () => {
  served = await serveApp();
  s = await createStudioWithRoles(served);
  p = await seedAuditedProject(served.deps, s, { title: `Wetlands atlas ${tag}`, score: engineScore, samples: 2000 });
  reviewerBrowser = await launchBrowser({ baseURL: served.url });
  editorBrowser = await launchBrowser({ baseURL: served.url });
});

afterAll(async () => {
  await reviewerBrowser?.close();
  await editorBrowser?.close();
  await served?.close();
});

/** The e-mailed link, pointed at this run's server (mails carry the configured public address). */
async function linkFromMail(): Promise<string> {
  const mail = await mailTo(reviewer.email);
  const link = /https?:\/\/\S+\/accept-invite\?token=\S+/.exec(mail.text)?.[0];
  expect(link, mail.text).toBeTruthy();
  const url = new URL(link!);
  return `${url.pathname}${url.search}`;
}

async function signIn(page: Page, email: string, password: string) {
  await page.waitForURL('**/sign-in?next=**');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
}

describe('client sign-off in the browser', () => {
  let page: Page;
  let editorPage: Page;

  it('the editor shortlists two candidates on the Review tab and sends them for sign-off', async () => {
    editorPage = await editorBrowser.newPage();
    await editorPage.goto(`/projects/${p.projectId}?tab=review`);
    await signIn(editorPage, s.users.editor.email, s.users.editor.password);
    await editorPage.waitForURL(`**/projects/${p.projectId}?tab=review`);
    const form = editorPage.getByRole('form', { name: 'Request sign-off' });
    await form.getByRole('button', { name: 'Send for sign-off' }).click();
    await form.getByText('Shortlist at least one candidate.').waitFor();
    await form.getByRole('checkbox', { name: /Albers equal-area/ }).check();
    await form.getByRole('checkbox', { name: /Lambert conformal conic/ }).check();
    await form.getByLabel('Recommendation').fill('We recommend the Albers projection.\n\n- true areas for the wetland statistics\n- a familiar outline');
    await form.getByText('As the client will read it').waitFor();
    await form.getByLabel('Reviewers’ e-mail addresses').fill(reviewer.email);
    await form.getByRole('button', { name: 'Send for sign-off' }).click();
    await editorPage.getByText('Round 1 is with the client').waitFor();
    await editorPage.getByRole('region', { name: /Round 1/ }).getByText('Awaiting the client').waitFor();
    await editorPage.screenshot({ path: screenshotPath('signoff-request.png'), fullPage: true });
  });

  it('the reviewer follows the e-mailed link, sets a password and lands on the review', async () => {
    page = await reviewerBrowser.newPage();
    await page.goto(await linkFromMail());
    await page.getByLabel('Your name').fill(reviewer.name);
    await page.getByLabel('Choose a password').fill(reviewer.password);
    await page.getByRole('button', { name: /^Join / }).click();
    await page.waitForURL(`**/review/${p.projectId}`);
    await page.getByRole('heading', { level: 1, name: `Review: Wetlands atlas ${tag}` }).waitFor();
    await page.getByText('true areas for the wetland statistics').waitFor();
    await page.getByRole('table', { name: 'Shortlisted candidates' }).waitFor();
    expect(await page.getByRole('navigation', { name: 'Main' }).getByRole('link').allTextContents()).toEqual(['Projects', 'Reviews']);
    await page.screenshot({ path: screenshotPath('signoff-review.png'), fullPage: true });
  });

  it('opens the compare view of the shortlist, with its heatmaps loaded', async () => {
    await page.getByRole('link', { name: 'Open the compare view' }).click();
    await page.waitForURL(`**/projects/${p.projectId}/compare?**`);
    const heatmaps = page.locator('img[src*="/heatmap/"]');
    await heatmaps.first().waitFor();
    await page.waitForFunction(() => {
      const imgs = [...document.querySelectorAll<HTMLImageElement>('img[src*="/heatmap/"]')];
      return imgs.length >= 2 && imgs.every((i) => i.complete && i.naturalWidth > 0);
    });
    await page.screenshot({ path: screenshotPath('signoff-compare.png'), fullPage: true });
    await page.goBack();
    await page.waitForURL(`**/review/${p.projectId}`);
  });

  it('approves one candidate with their typed name as signature', async () => {
    const form = page.getByRole('form', { name: 'Approve a candidate' });
    await form.getByRole('button', { name: 'Approve and sign' }).click();
    await form.getByText('Choose the candidate you approve.').waitFor();
    await form.getByRole('radio', { name: /Lambert conformal conic/ }).check();
    await form.getByLabel('Signature').fill('Somebody Else');
    await form.getByRole('button', { name: 'Approve and sign' }).click();
    await form.getByText(`Type your name as on your account: ${reviewer.name}.`).waitFor();
    await form.getByLabel('Signature').fill(reviewer.name.toUpperCase());
    await form.getByLabel('Comment (optional)').fill('Conformal suits the navigation insets.');
    await form.getByRole('button', { name: 'Approve and sign' }).click();
    await page.getByRole('status').filter({ hasText: 'Signed off' }).waitFor();
    const stored = await served.deps.dataSource.getRepository(SignOff).findOneByOrFail({ projectId: p.projectId });
    expect(await page.getByTestId('record-hash').textContent()).toBe(stored.recordHash);
    expect(stored.candidateId).toBe(p.candidateIds[1]);
    await page.screenshot({ path: screenshotPath('signoff-approved.png'), fullPage: true });
  });

  it('the editor sees the approval, the record and the history', async () => {
    await editorPage.reload();
    const round = editorPage.getByRole('region', { name: /Round 1/ });
    await round.getByText('Approved', { exact: true }).first().waitFor();
    await round.getByText(`${reviewer.name} approved “Lambert conformal conic”`).waitFor();
    const stored = await served.deps.dataSource.getRepository(SignOff).findOneByOrFail({ projectId: p.projectId });
    expect(await editorPage.getByTestId('record-hash').textContent()).toBe(stored.recordHash);
    await editorPage.getByRole('tab', { name: 'History' }).click();
    const history = editorPage.getByRole('list', { name: 'Project history, newest first' });
    await history.getByText(/^Approved “Lambert conformal conic” in round 1/).waitFor();
    await history.getByText(/^Sent round 1/).waitFor();
    expect(reviewerBrowser.problems).toEqual([]);
    expect(editorBrowser.problems).toEqual([]);
  });
});
