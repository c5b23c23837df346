import { existsSync, mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import type { Server } from 'node:http';
import net from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { afterAll, afterEach, beforeAll, beforeEach } from 'vitest';
import { DEMO_PASSWORD } from '../../seeders/data/demo-accounts';
import { useTestServer, type TestServer } from '../support/app';

export const SCREENSHOT_DIR = path.resolve('test-output/screenshots');

/** A free TCP port on 127.0.0.1, so APP_URL (the links in e-mails) can name the port the app will listen on. */
export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const probe = net.createServer();
    probe.once('error', reject);
    probe.listen(0, '127.0.0.1', () => {
      const { port } = probe.address() as net.AddressInfo;
      probe.close(() => resolve(port));
    });
  });
}

export function listen(app: import('express').Express, port: number): Promise<Server> {
  return new Promise((resolve, reject) => {
    const server = app.listen(port, '127.0.0.1');
    server.once('listening', () => resolve(server));
    server.once('error', reject);
  });
}

export function closeServer(server: Server | undefined): Promise<void> {
  if (!server) return Promise.resolve();
  server.closeAllConnections();
  return new Promise((resolve) => server.close(() => resolve()));
}

export function assertClientBuilt() {
  if (!existsSync(path.resolve('dist/index.html'))) {
    throw new Error(
      'dist/index.html is missing: build the client first (node node_modules/vite/bin/vite.js build).',
    );
  }
}

export interface Browser {
  context: BrowserContext;
  page: Page;
  /** Errors the page threw or logged, other than the expected 401 of the signed-out session probe. */
  problems: string[];
  shot(name: string): Promise<void>;
  close(): Promise<void>;
}

/** Debian's chromium, headless, in a throwaway profile, at the size the product is designed for. */
export async function launchBrowser(): Promise<Browser> {
  mkdirSync(SCREENSHOT_DIR, { recursive: true });
  const profile = mkdtempSync(path.join(tmpdir(), 'phasewright-e2e-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: '/usr/bin/chromium',
    headless: true,
    viewport: { width: 1280, height: 800 },
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
  context.setDefaultTimeout(20_000);
  const page = context.pages()[0] ?? (await context.newPage());
  const problems: string[] = [];
  page.on('pageerror', (error) => problems.push(`page error: ${error.message}`));
  page.on('console', (message) => {
    if (message.type() !== 'error') return;
    // The browser logs every non-2xx fetch; 401 and 400 are expected answers in these flows.
    if (/status of (401|400)/.test(message.text())) return;
    problems.push(`console: ${message.text()}`);
  });
  return {
    context,
    page,
    problems,
    shot: async (name) => {
      await page.screenshot({ path: path.join(SCREENSHOT_DIR, `${name}.png`) });
    },
    close: async () => {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}

export interface BrowserFlows {
  /** Base URL of the app under test, also its APP_URL (the links in e-mails). */
  readonly base: string;
  /** The real server: database, mail fake and job queue, with the demo seed. */
  readonly server: TestServer;
  /** The browser of the running flow. */
  readonly browser: Browser;
}

/**
 * Registers the hooks every browser test file needs: the real server with the
 * demo seed serving the built client on a free port, and chromium. With
 * `profile: 'per-flow'` each test gets a fresh browser profile (nothing signed
 * in or cached carries over, so one failing flow cannot leave the next on the
 * wrong page); with 'per-file' the flows of a file share one, in order.
 * `lastShot` names a screenshot of each flow's last screen, kept for looking at
 * when something fails.
 */
export async function useBrowserFlows(options: {
  profile: 'per-flow' | 'per-file';
  lastShot?: string;
}): Promise<BrowserFlows> {
  const port = await freePort();
  const base = `http://127.0.0.1:${port}`;
  const server = useTestServer({ APP_URL: base, PHASEWRIGHT_SEED_DEMO: '1' });
  let http: Server | undefined;
  let browser: Browser | undefined;

  beforeAll(async () => {
    assertClientBuilt();
    http = await listen(server.app, port);
    if (options.profile === 'per-file') browser = await launchBrowser();
  });
  if (options.profile === 'per-flow') {
    beforeEach(async () => {
      browser = await launchBrowser();
    });
  }
  afterEach(async () => {
    if (options.lastShot) await browser?.shot(options.lastShot);
    if (options.profile === 'per-flow') await browser?.close();
  });
  afterAll(async () => {
    if (options.profile === 'per-file') await browser?.close();
    await closeServer(http);
  });

  return {
    base,
    server,
    get browser() {
      if (!browser) throw new Error('The browser starts in the test hooks; use it inside a test.');
      return browser;
    },
  };
}

/**
 * Signs a demo account in through the sign-in page, as its user would, and waits for the first
 * page after it. Older browser tests still spell this out themselves; new ones call this.
 */
export async function signInAs(
  page: Page,
  base: string,
  email: string,
  landing: { level: 1; name: string } = { level: 1, name: 'Routes' },
): Promise<void> {
  await page.goto(base + '/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('heading', landing).waitFor();
}
