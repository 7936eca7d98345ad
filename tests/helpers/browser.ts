import net from 'node:net';
import fs from 'node:fs';
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import type { Sequelize } from 'sequelize';
import { createApp, stopApp } from '../../server/app';
import { REPO_ROOT } from '../../server/config';
import { CSRF_COOKIE, csrfTokenFor, SESSION_COOKIE } from '../../server/middleware/session-cookie';
import { openTestDatabase, testConfig } from './db';

export const PHONE = { width: 390, height: 844 } as const;
export const WIDE = { width: 1440, height: 900 } as const;

export type BrowserRig = {
  baseUrl: string;
  sequelize: Sequelize;
  /**
   * A page in a fresh browser profile. Service workers are blocked unless asked for: the offline app shell precaches
   * the whole build on first load, which only the offline test needs.
   */
  newPage: (viewport: { width: number; height: number }, options?: { serviceWorkers?: 'allow' | 'block' }) => Promise<Page>;
  shot: (page: Page, name: string) => Promise<void>;
  /** Signs a page's browser context in with a token from the API, as the server's session cookies would. */
  signIn: (page: Page, token: string) => Promise<void>;
  close: () => Promise<void>;
};

/** The real server (API + exported web build) on a free port, and Debian's Chromium driving it. */
export async function startBrowserRig(suite: string): Promise<BrowserRig> {
  const dist = process.env.WEB_DIST_DIR ?? path.join(REPO_ROOT, 'dist');
  if (!fs.existsSync(path.join(dist, 'index.html'))) throw new Error(`No web build in ${dist}: run through npm test.`);
  // The port is known before the app is made, so links that leave the page (label QR codes, e-mails) name this server.
  const port = await freePort();
  const baseUrl = `http://127.0.0.1:${port}`;
  const config = testConfig({ WEB_DIST_DIR: dist, PUBLIC_URL: baseUrl });
  const sequelize = await openTestDatabase();
  const app = createApp(config, sequelize);
  const server: Server = await new Promise((resolve) => {
    const s = app.listen(port, '127.0.0.1', () => resolve(s));
  });
  const userDir = fs.mkdtempSync(path.join(os.tmpdir(), 'cw-chromium-'));
  const contexts: BrowserContext[] = [];
  const shotsDir = path.join(process.env.TEST_OUTPUT_DIR ?? path.join(REPO_ROOT, 'test-output'), 'screens', suite);
  fs.mkdirSync(shotsDir, { recursive: true });
  let n = 0;

  return {
    baseUrl,
    sequelize,
    async newPage(viewport, options = {}) {
      const context = await chromium.launchPersistentContext(fs.mkdtempSync(path.join(userDir, 'p-')), {
        executablePath: process.env.CHROME_PATH ?? '/usr/bin/chromium',
        headless: true,
        viewport,
        serviceWorkers: options.serviceWorkers ?? 'block',
        args: ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
      });
      contexts.push(context);
      const page = context.pages()[0] ?? (await context.newPage());
      page.setDefaultTimeout(15_000);
      page.on('pageerror', (err) => {
        throw new Error(`page error: ${err.message}`);
      });
      return page;
    },
    async signIn(page, token) {
      const { jti } = JSON.parse(Buffer.from(token.split('.')[1], 'base64url').toString('utf8')) as { jti: string };
      await page.context().addCookies([
        { name: SESSION_COOKIE, value: token, domain: '127.0.0.1', path: '/api', httpOnly: true, sameSite: 'Strict' },
        { name: CSRF_COOKIE, value: csrfTokenFor(config, jti), domain: '127.0.0.1', path: '/', sameSite: 'Strict' },
      ]);
    },
    async shot(page, name) {
      n += 1;
      await page.screenshot({ path: path.join(shotsDir, `${String(n).padStart(2, '0')}-${name}.png`), fullPage: true });
    },
    async close() {
      await Promise.all(contexts.map((c) => c.close()));
      await new Promise((resolve) => server.close(resolve));
      await stopApp(app);
      await sequelize.close();
      fs.rmSync(userDir, { recursive: true, force: true });
    },
  };
}

/** A loopback port nobody is listening on right now. */
function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const probe = net.createServer();
    probe.once('error', reject);
    probe.listen(0, '127.0.0.1', () => {
      const { port } = probe.address() as AddressInfo;
      probe.close(() => resolve(port));
    });
  });
}
