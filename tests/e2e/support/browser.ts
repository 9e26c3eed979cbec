import { afterAll, beforeAll, beforeEach } from 'vitest';
import { existsSync } from 'node:fs';
import { cp, mkdir, mkdtemp, readdir, readFile, rm } from 'node:fs/promises';
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { createApp } from '../../../server/app';
import { pool } from '../../../db/client';

const CLIENT_DIR = path.resolve('dist/client');
export const SCREENSHOT_DIR = path.resolve('test-output/screenshots');

const CHROMIUM_ARGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
  '--use-angle=swiftshader',
  '--enable-unsafe-swiftshader',
];

export interface RunningApp {
  baseUrl: string;
  stop: () => Promise<void>;
}

/** Every file that index.html and the scripts name (entry, page chunks, styles, fonts) is present. */
async function isComplete(clientDir: string): Promise<boolean> {
  const html = await readFile(path.join(clientDir, 'index.html'), 'utf8');
  const named = [...html.matchAll(/(?:src|href)="\/([^"]+)"/g)].map((m) => m[1]);
  const assetsDir = path.join(clientDir, 'assets');
  for (const file of await readdir(assetsDir)) {
    if (!file.endsWith('.js') && !file.endsWith('.css')) continue;
    const text = await readFile(path.join(assetsDir, file), 'utf8');
    // Hashed build outputs only (name-XXXXXXXX.ext), never strings that merely look like file names.
    for (const m of text.matchAll(/["'(/]([\w.-]+-[\w-]{8}\.(?:js|css|woff2?))["')]/g)) named.push(`assets/${m[1]}`);
  }
  return named.every((file) => existsSync(path.join(clientDir, file)));
}

/** A private copy of the built client, so that a `vite build` started elsewhere while the tests run
 * (it empties dist/client first) cannot pull page chunks away mid-test. Checks that every file the
 * copy names is really there, else copies again. */
async function snapshotClient(): Promise<string> {
  for (let attempt = 1; attempt <= 5; attempt++) {
    if (existsSync(path.join(CLIENT_DIR, 'index.html'))) {
      const copy = await mkdtemp(path.join(os.tmpdir(), 'compline-client-'));
      try {
        await cp(CLIENT_DIR, copy, { recursive: true });
        if (await isComplete(copy)) return copy;
      } catch {
        // a build was writing while we copied: try again
      }
      await rm(copy, { recursive: true, force: true });
    }
    await new Promise((resolve) => setTimeout(resolve, 2_000));
  }
  throw new Error('dist/client is missing or incomplete: build the client first (npm test does; with TEST_QUICK=1 run `npx vite build`).');
}

/** Starts Compline in this process on a free loopback port, serving a snapshot of the built client
 * (scripts/test.sh runs `vite build` first) and the API against the test database. */
export async function startApp(): Promise<RunningApp> {
  const clientDir = await snapshotClient();
  const app = createApp({ clientDir });
  const server = await new Promise<Server>((resolve, reject) => {
    const listening = app.listen(0, '127.0.0.1', (error?: Error) => (error ? reject(error) : resolve(listening)));
  });
  const { port } = server.address() as AddressInfo;
  return {
    baseUrl: `http://127.0.0.1:${port}`,
    stop: async () => {
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await pool.end();
      await rm(clientDir, { recursive: true, force: true });
    },
  };
}

/**
 * For one describe block: Compline started before its tests and one Chromium beside it, both stopped
 * after them. With freshCookies every test starts signed out. Read `.app` and `.browser` inside the
 * tests (they exist once beforeAll has run).
 */
export function appAndBrowser(options: { viewport?: { width: number; height: number }; freshCookies?: boolean } = {}): { readonly app: RunningApp; readonly browser: RunningBrowser } {
  const running = {} as { app: RunningApp; browser: RunningBrowser };
  beforeAll(async () => {
    running.app = await startApp();
    running.browser = await launchBrowser(options.viewport);
  });
  afterAll(async () => {
    await running.browser?.close();
    await running.app?.stop();
  });
  if (options.freshCookies) {
    beforeEach(async () => {
      await running.browser.context.clearCookies();
    });
  }
  return running;
}

export interface RunningBrowser {
  context: BrowserContext;
  close: () => Promise<void>;
}

/** Debian's Chromium, headless, with a fresh profile that is deleted afterwards. */
export async function launchBrowser(viewport = { width: 1280, height: 800 }): Promise<RunningBrowser> {
  const profileDir = await mkdtemp(path.join(os.tmpdir(), 'compline-chromium-'));
  const context = await chromium.launchPersistentContext(profileDir, {
    executablePath: '/usr/bin/chromium',
    headless: true,
    args: CHROMIUM_ARGS,
    viewport,
    locale: 'en-GB',
    timezoneId: 'UTC',
  });
  // Well under the test timeout, so that a failing wait names its locator.
  context.setDefaultTimeout(10_000);
  return {
    context,
    close: async () => {
      await context.close();
      await rm(profileDir, { recursive: true, force: true });
    },
  };
}

/** Saves a full-page screenshot as test-output/screenshots/<name>.png once the fonts are in. */
export async function saveScreenshot(page: Page, name: string): Promise<string> {
  await mkdir(SCREENSHOT_DIR, { recursive: true });
  await page.evaluate(() => document.fonts.ready.then(() => undefined));
  const file = path.join(SCREENSHOT_DIR, `${name}.png`);
  await page.screenshot({ path: file, fullPage: true, animations: 'disabled' });
  return file;
}

export interface PageWatch {
  /** Uncaught exceptions and console errors, in the order they happened. */
  errors: string[];
  /** Every HTTP answer of 400 or more, as "<status> <METHOD> <path>". */
  failedResponses: string[];
}

/** Records what went wrong in a page. Chromium also logs each 4xx/5xx answer as a console error
 * ("Failed to load resource"); those are left out of `errors` because `failedResponses` lists the
 * same answers precisely, for the test to compare with the ones it expects. */
export function watchPage(page: Page): PageWatch {
  const watch: PageWatch = { errors: [], failedResponses: [] };
  page.on('pageerror', (error) => watch.errors.push(`uncaught: ${error.message}`));
  page.on('console', (message) => {
    if (message.type() !== 'error') return;
    if (message.text().startsWith('Failed to load resource: the server responded with a status of')) return;
    watch.errors.push(`console.error: ${message.text()}`);
  });
  page.on('response', (response) => {
    if (response.status() < 400) return;
    const url = new URL(response.url());
    watch.failedResponses.push(`${response.status()} ${response.request().method()} ${url.pathname}`);
  });
  return watch;
}

/** The failed answers that match none of the expected ones (exact strings or patterns). */
export function unexpectedFailures(watch: PageWatch, expected: ReadonlyArray<string | RegExp>): string[] {
  return watch.failedResponses.filter(
    (failure) => !expected.some((allowed) => (typeof allowed === 'string' ? allowed === failure : allowed.test(failure))),
  );
}
