import { existsSync, mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import type { Server } from 'node:http';
import net from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { chromium, type BrowserContext, type Page } from 'playwright-core';

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
    throw new Error('dist/index.html is missing: build the client first (node node_modules/vite/bin/vite.js build).');
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
    args: ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
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
