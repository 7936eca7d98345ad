import fs from 'node:fs';
import path from 'node:path';
import { chromium } from 'playwright-core';
import type { BenchModule, TaskResult } from './types';

type Loaded = { files: number; sent: number; decoded: number; entry: number };

/** Every script the page loads before it settles: bytes on the wire (brotli here) and after decoding. */
async function firstScreenJs(url: string): Promise<Loaded> {
  const browser = await chromium.launch({ executablePath: process.env.CHROME_PATH ?? '/usr/bin/chromium', args: ['--no-sandbox'] });
  try {
    const page = await browser.newPage();
    const seen: Promise<{ sent: number; decoded: number; entry: boolean }>[] = [];
    page.on('response', (res) => {
      if (!res.url().endsWith('.js')) return;
      seen.push(
        res.body().then((body) => ({
          sent: Number(res.headers()['content-length'] ?? body.length),
          decoded: body.length,
          entry: /\/(entry|__expo-metro-runtime)-/.test(res.url()),
        })),
      );
    });
    await page.goto(url, { waitUntil: 'networkidle' });
    await page.getByText('Sign in').first().waitFor({ timeout: 30_000 });
    const all = await Promise.all(seen);
    return {
      files: all.length,
      sent: all.reduce((n, r) => n + r.sent, 0),
      decoded: all.reduce((n, r) => n + r.decoded, 0),
      entry: all.filter((r) => r.entry).reduce((n, r) => n + r.sent, 0),
    };
  } finally {
    await browser.close();
  }
}

const kb = (n: number) => `${Math.round(n / 1024)} KB`;

/**
 * The web app's first screen (sign-in): the JavaScript it loads, compressed and decoded, from the exported build the
 * bench server serves (WEB_DIST_DIR; skipped with a note when there is no build). The runtime and entry chunk (React,
 * React Native Web, Expo Router and the root layout's providers) are printed apart as the nearest figure to a bare
 * Expo Router app with the same providers; no bare app is built here.
 */
export const scenarios: BenchModule['scenarios'] = async (ctx) => [
  {
    kind: 'task',
    name: 'web first screen (/sign-in): JavaScript loaded',
    run: async (): Promise<TaskResult> => {
      if (!fs.existsSync(path.join(ctx.config.WEB_DIST_DIR, 'index.html'))) {
        return { figure: `no web build in ${ctx.config.WEB_DIST_DIR} (run npm start once, or set WEB_DIST_DIR)`, unit: '' };
      }
      const js = await firstScreenJs(`${ctx.baseUrl}/sign-in`);
      return {
        figure: `${kb(js.sent)} sent (${kb(js.decoded)} decoded) in ${js.files} files; runtime + entry chunk ${kb(js.entry)} sent`,
        unit: '',
      };
    },
  },
];
