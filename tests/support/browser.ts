import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { chromium, type BrowserContext, type Page } from 'playwright-core';

/** Debian's Chromium (tests/run-all.sh installs it when missing). */
const CHROMIUM = process.env.WARPMETER_CHROMIUM ?? '/usr/bin/chromium';

// Quiet, offline, single-process-friendly flags for a container without a GPU or a sandbox.
const ARGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];

export interface TestBrowser {
  context: BrowserContext;
  /** A new tab whose uncaught errors and console errors are collected in `problems`. */
  newPage(): Promise<Page>;
  /** Uncaught page errors and console errors seen so far in any tab of this browser. */
  problems: string[];
  /** Console warnings (React and router advice), for a person to read; not a failure. */
  warnings: string[];
  close(): Promise<void>;
}

/**
 * One browser with its own profile (a fresh temporary directory), so cookies never leak between
 * tests. Launch two when a test needs two people signed in at once.
 */
export async function launchBrowser(opts: { baseURL?: string } = {}): Promise<TestBrowser> {
  const profile = fs.mkdtempSync(path.join(os.tmpdir(), 'warpmeter-chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: CHROMIUM,
    headless: true,
    args: ARGS,
    baseURL: opts.baseURL,
    viewport: { width: 1280, height: 860 },
    locale: 'en-GB',
    timezoneId: 'UTC',
  });
  context.setDefaultTimeout(15_000);
  const problems: string[] = [];
  const warnings: string[] = [];
  const watch = (page: Page) => {
    page.on('pageerror', (err) => problems.push(`page error: ${err.message}`));
    page.on('console', (msg) => {
      // Failed requests the app handled itself (a 401 session probe, a refused form) are logged
      // by Chromium as console errors; only script errors count as problems.
      if (msg.type() === 'error' && !msg.text().startsWith('Failed to load resource')) problems.push(`console: ${msg.text()}`);
      if (msg.type() === 'warning') warnings.push(msg.text());
    });
  };
  context.pages().forEach(watch);
  context.on('page', watch);
  return {
    context,
    problems,
    warnings,
    newPage: async () => {
      const blank = context.pages().find((p) => p.url() === 'about:blank');
      return blank ?? context.newPage();
    },
    close: async () => {
      await context.close();
      fs.rmSync(profile, { recursive: true, force: true });
    },
  };
}

/** Where browser tests put screenshots for a person to look at (ignored by git). */
export function screenshotPath(name: string): string {
  const dir = path.resolve(import.meta.dirname, '../.tmp');
  fs.mkdirSync(dir, { recursive: true });
  return path.join(dir, name);
}
