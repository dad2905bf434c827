import path from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startAuditJobs, stopAuditJobs } from '../../server/jobs/runner.js';
import { launchBrowser, screenshotPath, type TestBrowser } from '../support/browser.js';
import { serveApp, type ServedApp } from '../support/serve-app.js';
import { createStudioWithRoles, type StudioFixture } from '../support/studio-fixture.js';

/**
 * The audit workflow in a real browser, as a cartographer works: upload a zipped shapefile in a
 * projected CRS (Michigan in EPSG:5070, from fixtures/regions/), add two proposed candidates,
 * run an audit and watch it progress, read the scorecard table, and open the compare view with
 * its heatmap images loaded.
 */
const SHAPEFILE = path.resolve(import.meta.dirname, '../../fixtures/regions/michigan-epsg5070.zip');

let served: ServedApp;
let browser: TestBrowser;
let page: Page;
let s: StudioFixture;
let projectId: number;

beforeAll(async () => {
  served = await serveApp();
  await startAuditJobs(served.deps);
  s = await createStudioWithRoles(served);
  const res = await s.cartographer.post('/api/projects', { title: 'Lake states atlas', clientName: 'Northwater Press', purpose: 'equal-area', scaleBand: 'province' });
  projectId = res.body.id;
  browser = await launchBrowser({ baseURL: served.url });
  page = await browser.newPage();
});

afterAll(async () => {
  await browser?.close();
  if (served) await stopAuditJobs(served.deps);
  await served?.close();
});

describe('audit workflow in the browser', () => {
  it('signs the cartographer in', async () => {
    await page.goto('/sign-in');
    await page.getByLabel('E-mail').fill(s.users.cartographer.email);
    await page.getByLabel('Password').fill(s.users.cartographer.password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL('**/projects');
  });

  it('uploads a zipped shapefile as the region', async () => {
    await page.goto(`/projects/${projectId}?tab=region`);
    await page.getByLabel('Region file').setInputFiles(SHAPEFILE);
    await page.getByRole('button', { name: 'Check the file' }).click();
    await page.getByRole('button', { name: 'Use as the project’s region' }).click();
    await page.getByRole('img', { name: /^Map of / }).waitFor();
  });

  it('adds two proposed candidates with one click each', async () => {
    await page.goto(`/projects/${projectId}?tab=candidates`);
    const proposals = page.getByRole('list', { name: 'Proposed candidates' });
    const addButtons = proposals.getByRole('button', { name: /^Add / });
    await addButtons.first().waitFor();
    for (let i = 0; i < 2; i++) {
      const before = await proposals.getByText('Added', { exact: true }).count();
      await addButtons.first().click();
      await expect.poll(() => proposals.getByText('Added', { exact: true }).count(), { timeout: 15_000 }).toBe(before + 1);
    }
  });

  it('runs an audit and shows its progress, then the scorecard table', async () => {
    await page.goto(`/projects/${projectId}?tab=audits`);
    const form = page.getByRole('form', { name: 'Start an audit' });
    await expect.poll(() => form.getByRole('checkbox').count()).toBe(2);
    await form.getByLabel('Samples').fill('300000');
    await form.getByRole('button', { name: 'Run audit' }).click();
    // The bar appears while the job waits or runs, and leaves when it is done.
    await page.getByRole('progressbar').first().waitFor({ timeout: 15_000 });
    await page.screenshot({ path: screenshotPath('audit-progress.png') });
    const table = page.getByRole('table', { name: /^Scorecards, ranked for an equal-area map/ });
    await table.waitFor({ timeout: 90_000 });
    await expect.poll(() => table.locator('tbody tr').count()).toBe(2);
    expect(await table.getByText('1 · best fit').count()).toBe(1);
    // A metric header explains itself on keyboard focus.
    await table.getByRole('button', { name: /Area spread/ }).focus();
    const tip = page.getByRole('tooltip').filter({ hasText: 'most enlarged place' });
    await tip.waitFor({ state: 'visible' });
    await page.screenshot({ path: screenshotPath('audit-scorecards.png'), fullPage: true });
  });

  it('opens the compare view with both heatmaps loaded and draws the routes', async () => {
    const boxes = page.getByRole('group', { name: /Compare side by side/ }).getByRole('checkbox');
    await boxes.nth(0).check();
    await boxes.nth(1).check();
    await page.getByRole('link', { name: 'Compare 2 candidates' }).click();
    await page.waitForURL(/\/compare\?audit=\d+&candidates=\d+,\d+/);
    const images = page.locator('img[src*="/heatmap/"]');
    await expect.poll(() => images.count()).toBe(2);
    await expect
      .poll(() => images.evaluateAll((els) => els.map((e) => (e as HTMLImageElement).complete && (e as HTMLImageElement).naturalWidth)), { timeout: 30_000 })
      .toEqual([512, 512]);
    await expect.poll(() => page.locator('svg ellipse').count()).toBeGreaterThan(10);
    await page.getByRole('radio', { name: 'Angular deformation' }).check();
    await expect
      .poll(() => images.evaluateAll((els) => els.map((e) => (e as HTMLImageElement).src.includes('angular-deformation') && (e as HTMLImageElement).complete && (e as HTMLImageElement).naturalWidth > 0)), { timeout: 30_000 })
      .toEqual([true, true]);
    await page.getByRole('button', { name: 'Draw great circle and rhumb line' }).click();
    await expect.poll(() => page.getByRole('table', { name: 'Route lengths on the ground and on this map' }).count(), { timeout: 15_000 }).toBe(2);
    await page.screenshot({ path: screenshotPath('audit-compare.png'), fullPage: true });
    expect(browser.problems).toEqual([]);
  });
});
