import fs from 'node:fs';
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import type { Sequelize } from 'sequelize';
import { createApp, stopApp } from '../../server/app';
import { REPO_ROOT } from '../../server/config';
import { openTestDatabase, testConfig } from './db';

export const PHONE = { width: 390, height: 844 } as const;
export const WIDE = { width: 1440, height: 900 } as const;

export type BrowserRig = {
  baseUrl: string;
  sequelize: Sequelize;
  newPage: (viewport: { width: number; height: number }) => Promise<Page>;
  shot: (page: Page, name: string) => Promise<void>;
  close: () => Promise<void>;
};

/** The real server (API + exported web build) on a free port, and Debian's Chromium driving it. */
export async function startBrowserRig(suite: string): Promise<BrowserRig> {
  const dist = process.env.WEB_DIST_DIR ?? path.join(REPO_ROOT, 'dist');
  if (!fs.existsSync(path.join(dist, 'index.html'))) throw new Error(`No web build in ${dist}: run through npm test.`);
  const config = testConfig({ WEB_DIST_DIR: dist });
  const sequelize = await openTestDatabase();
  const app = createApp(config, sequelize);
  const server: Server = await new Promise((resolve) => {
    const s = app.listen(0, '127.0.0.1', () => resolve(s));
  });
  const baseUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  const userDir = fs.mkdtempSync(path.join(os.tmpdir(), 'cw-chromium-'));
  const contexts: BrowserContext[] = [];
  const shotsDir = path.join(process.env.TEST_OUTPUT_DIR ?? path.join(REPO_ROOT, 'test-output'), 'screens', suite);
  fs.mkdirSync(shotsDir, { recursive: true });
  let n = 0;

  return {
    baseUrl,
    sequelize,
    async newPage(viewport) {
      const context = await chromium.launchPersistentContext(fs.mkdtempSync(path.join(userDir, 'p-')), {
        executablePath: process.env.CHROME_PATH ?? '/usr/bin/chromium',
        headless: true,
        viewport,
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
