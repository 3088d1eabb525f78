import { existsSync } from 'node:fs';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import { chromium, type Browser, type Page } from 'playwright-core';
import { startTestApp, type TestApp } from './test-app';

const CHROMIUM_FLAGS = [
  '--no-sandbox',
  '--disable-gpu',
  '--disable-dev-shm-usage',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
  '--disable-quic',
  '--no-first-run',
];

export interface BrowserHarness {
  t: TestApp;
  baseUrl: string;
  browser: Browser;
  newPage(options?: { width?: number; height?: number }): Promise<Page>;
  close(): Promise<void>;
}

/** The real API serving the built client on a free port, plus Debian's Chromium, headless. */
export async function startBrowserHarness(): Promise<BrowserHarness> {
  // E2E_STATIC_DIR lets a run use a client built elsewhere (e.g. from another checkout).
  const staticDir = process.env.E2E_STATIC_DIR ?? path.resolve(__dirname, '../../dist/trenchwork/browser');
  if (!existsSync(path.join(staticDir, 'index.html'))) throw new Error(`No built client in ${staticDir}: run \`npm test\` (it builds it).`);
  // Ask the OS for a free port first so PUBLIC_URL (used in CSRF origin checks and mail links) is right.
  const probe = createServer();
  await new Promise<void>((resolve) => probe.listen(0, '127.0.0.1', resolve));
  const port = (probe.address() as AddressInfo).port;
  await new Promise<void>((resolve) => probe.close(() => resolve()));
  const baseUrl = `http://127.0.0.1:${port}`;
  const t = await startTestApp({ STATIC_DIR: staticDir, PUBLIC_URL: baseUrl, PORT: String(port) });
  const server: Server = createServer(t.app);
  await new Promise<void>((resolve) => server.listen(port, '127.0.0.1', resolve));
  const browser = await chromium.launch({
    executablePath: process.env.CHROMIUM_PATH || '/usr/lib/chromium/chromium',
    headless: true,
    // playwright gives every launch a fresh temporary profile of its own.
    args: CHROMIUM_FLAGS,
  });
  return {
    t,
    baseUrl,
    browser,
    async newPage(options = {}) {
      const context = await browser.newContext({ viewport: { width: options.width ?? 1280, height: options.height ?? 800 }, baseURL: baseUrl });
      return context.newPage();
    },
    async close() {
      await browser.close();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await t.close();
    },
  };
}
