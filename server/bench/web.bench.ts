/**
 * The web app against a bare Expo Router app with the same root providers (server/bench/bare-app), both exported
 * and precompressed in this run and served the same way (server/web.ts): the JavaScript each first screen loads, and
 * Lighthouse 12 (median of BENCH_LIGHTHOUSE_RUNS runs, default 3) on the mobile and desktop presets for the sign-in
 * screen and the signed-in Today. Targets (issue 15): first-screen JavaScript ≤ 1.3× the bare app's; on mobile,
 * performance ≥ the bare app's score from the same run, accessibility ≥ 95, best practices ≥ 95; on desktop,
 * performance ≥ 90. Needs Chromium (CHROME_PATH, default /usr/bin/chromium). Run alone: `npm run bench -- --only web`.
 */
import { execFile } from 'node:child_process';
import fs from 'node:fs';
import { createServer } from 'node:http';
import type { AddressInfo } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { promisify } from 'node:util';
import express from 'express';
import { chromium } from 'playwright-core';
import { serveWeb } from '../web';
import type { LighthouseJob, LighthouseScores } from './lighthouse-run';
import type { BenchContext, BenchModule, TaskResult, TaskScenario } from './types';

const ROOT = path.resolve(__dirname, '../..');
const TSX = path.join(ROOT, 'node_modules/.bin/tsx');
const CHROME = process.env.CHROME_PATH ?? '/usr/bin/chromium';
const RUNS = Math.max(1, Number(process.env.BENCH_LIGHTHOUSE_RUNS ?? 3));
const LIGHTHOUSE_TIMEOUT_MS = 420_000;
const BUILD_TIMEOUT_MS = 20 * 60_000;
const JS_RATIO_LIMIT = 1.3;
const run = promisify(execFile);

type Cookie = NonNullable<LighthouseJob['cookies']>[number];
type Screen = { name: string; path: string; waitFor: string; signedIn: boolean };
type Prepared = { ours: string; bare: string; cookies: Cookie[]; buildMs: { ours: number; bare: number } };
type Loaded = { files: number; sent: number; decoded: number };
type Median = { performance: number; accessibility: number; bestPractices: number; lcpMs: number; tbtMs: number; runs: LighthouseScores[] };

const SCREENS: Screen[] = [
  { name: 'sign-in', path: '/sign-in', waitFor: 'Sign in', signedIn: false },
  { name: 'Today (signed in)', path: '/', waitFor: 'Log a meal', signedIn: true },
];
const BARE: Screen = { name: 'bare app', path: '/', waitFor: 'Bare app', signedIn: false };

const kb = (n: number) => `${Math.round(n / 1024)} KB`;

async function timed<T>(work: () => Promise<T>): Promise<[T, number]> {
  const start = Date.now();
  return [await work(), Date.now() - start];
}

/** Exports an Expo project for web into `out` and writes the brotli and gzip copies the server sends. */
async function exportWeb(projectRoot: string, out: string): Promise<void> {
  const env = { ...process.env, EXPO_NO_TELEMETRY: '1', EXPO_OFFLINE: '1', CI: '1' };
  await run(path.join(ROOT, 'node_modules/.bin/expo'), ['export', '--platform', 'web', '--output-dir', out], { cwd: projectRoot, env, timeout: BUILD_TIMEOUT_MS, maxBuffer: 64 * 1024 * 1024 });
  await run(TSX, [path.join(ROOT, 'server/cli/compress-web.ts'), out], { cwd: ROOT, timeout: BUILD_TIMEOUT_MS });
}

/** A session for a new member, as the cookies the browser would hold after signing up. */
async function signedInCookies(baseUrl: string): Promise<Cookie[]> {
  const res = await fetch(`${baseUrl}/api/auth/sign-up`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email: `bench-web-${Date.now()}@example.test`, displayName: 'Bench', password: 'oak lantern river 47 quietly' }),
  });
  if (res.status !== 201) throw new Error(`web bench sign-up failed: ${res.status} ${await res.text()}`);
  return res.headers.getSetCookie().map((line) => {
    const [pair, ...attrs] = line.split(';').map((s) => s.trim());
    const eq = pair.indexOf('=');
    const attr = (name: string) => attrs.find((a) => a.toLowerCase().startsWith(name));
    return {
      name: pair.slice(0, eq),
      value: pair.slice(eq + 1),
      path: attr('path=')?.slice(5) ?? '/',
      httpOnly: Boolean(attr('httponly')),
    };
  });
}

let prepared: Promise<Prepared> | undefined;

/** Builds both apps (ours only when its sources changed: server/scripts/build-web.sh), serves the bare one, signs in. */
function prepare(ctx: BenchContext): Promise<Prepared> {
  prepared ??= (async () => {
    if (!fs.existsSync(CHROME)) throw new Error(`Chromium not found at ${CHROME} (apt-get install chromium, or set CHROME_PATH)`);
    const [, ours] = await timed(() =>
      run('bash', [path.join(ROOT, 'server/scripts/build-web.sh')], { cwd: ROOT, env: { ...process.env, WEB_DIST_DIR: ctx.config.WEB_DIST_DIR }, timeout: BUILD_TIMEOUT_MS }),
    );
    const tmp = fs.mkdtempSync(path.join(os.tmpdir(), 'carbwright-bare-app-'));
    const bareDir = path.join(tmp, 'dist');
    const [, bare] = await timed(() => exportWeb(path.join(__dirname, 'bare-app'), bareDir));
    const app = express();
    serveWeb(app, bareDir);
    const bareServer = createServer(app);
    await new Promise<void>((resolve) => bareServer.listen(0, '127.0.0.1', resolve));
    // Neither keeps the bench process alive nor outlives it.
    bareServer.unref();
    process.once('exit', () => fs.rmSync(tmp, { recursive: true, force: true }));
    const cookies = await signedInCookies(ctx.baseUrl);
    return { ours: ctx.baseUrl, bare: `http://127.0.0.1:${(bareServer.address() as AddressInfo).port}`, cookies, buildMs: { ours, bare } };
  })();
  return prepared;
}

/** Every script the page loads before it settles: bytes on the wire (brotli here) and after decoding. */
async function firstScreenJs(origin: string, screen: Screen, cookies: Cookie[]): Promise<Loaded> {
  const browser = await chromium.launch({ executablePath: CHROME, args: ['--no-sandbox'] });
  try {
    const context = await browser.newContext();
    if (screen.signedIn) await context.addCookies(cookies.map((c) => ({ ...c, domain: new URL(origin).hostname, sameSite: 'Strict' as const })));
    const page = await context.newPage();
    const seen: Promise<{ sent: number; decoded: number }>[] = [];
    page.on('response', (res) => {
      if (!new URL(res.url()).pathname.endsWith('.js')) return;
      seen.push(res.body().then((body) => ({ sent: Number(res.headers()['content-length'] ?? body.length), decoded: body.length })));
    });
    await page.goto(`${origin}${screen.path}`, { waitUntil: 'networkidle', timeout: 120_000 });
    await page.getByText(screen.waitFor).first().waitFor({ timeout: 60_000 });
    await page.waitForLoadState('networkidle');
    const all = await Promise.all(seen);
    return { files: all.length, sent: all.reduce((n, r) => n + r.sent, 0), decoded: all.reduce((n, r) => n + r.decoded, 0) };
  } finally {
    await browser.close();
  }
}

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = Math.floor(sorted.length / 2);
  return sorted.length % 2 ? sorted[mid] : Math.round((sorted[mid - 1] + sorted[mid]) / 2);
}

async function lighthouseOnce(job: LighthouseJob): Promise<LighthouseScores> {
  const { stdout } = await run(TSX, [path.join(__dirname, 'lighthouse-run.ts'), JSON.stringify(job)], { cwd: ROOT, timeout: LIGHTHOUSE_TIMEOUT_MS, maxBuffer: 16 * 1024 * 1024 });
  return JSON.parse(stdout.trim().split('\n').pop() ?? '') as LighthouseScores;
}

const lighthouseRuns = new Map<string, Promise<Median>>();

/** Lighthouse RUNS times in a row on one screen and preset; the median of each figure. */
function lighthouse(ctx: BenchContext, screen: Screen, preset: LighthouseJob['preset']): Promise<Median> {
  const key = `${screen.name}|${preset}`;
  if (!lighthouseRuns.has(key)) {
    lighthouseRuns.set(key, (async () => {
      const p = await prepare(ctx);
      const origin = screen === BARE ? p.bare : p.ours;
      const runs: LighthouseScores[] = [];
      for (let i = 0; i < RUNS; i += 1) {
        const r = await lighthouseOnce({ url: `${origin}${screen.path}`, preset, chromePath: CHROME, cookies: screen.signedIn ? p.cookies : undefined });
        console.log(`  Lighthouse ${preset} ${screen.name} ${i + 1}/${RUNS}: performance ${r.performance}, accessibility ${r.accessibility}, best practices ${r.bestPractices}`);
        runs.push(r);
      }
      // A signed-in screen that lands on sign-in measured the wrong page.
      const landed = runs.find((r) => new URL(r.finalUrl).pathname !== screen.path);
      if (landed) throw new Error(`${screen.path} ended on ${landed.finalUrl}`);
      const m = (pick: (r: LighthouseScores) => number) => median(runs.map(pick));
      return { performance: m((r) => r.performance), accessibility: m((r) => r.accessibility), bestPractices: m((r) => r.bestPractices), lcpMs: m((r) => r.lcpMs), tbtMs: m((r) => r.tbtMs), runs };
    })());
  }
  return lighthouseRuns.get(key)!;
}

/** A task that reports a failure (no Chromium, a build that broke, a timeout) as its figure and as not met. */
function task(name: string, target: string | undefined, work: (ctx: BenchContext) => Promise<TaskResult>): TaskScenario {
  return {
    kind: 'task',
    name,
    run: async (ctx) => {
      try {
        return await work(ctx);
      } catch (err) {
        return { figure: `not measured: ${(err as Error).message.split('\n')[0]}`, unit: '', target, met: target ? false : undefined };
      }
    },
  };
}

const runsOf = (m: Median, pick: (r: LighthouseScores) => number) => `median of ${m.runs.map(pick).join(', ')}`;
const failingOf = (list: string[][]) => [...new Set(list.flat())];

function lighthouseTasks(screen: Screen): TaskScenario[] {
  const score = (preset: LighthouseJob['preset'], label: string, pick: (r: LighthouseScores) => number, failing?: (r: LighthouseScores) => string[]) =>
    async (ctx: BenchContext, limit: () => Promise<number>): Promise<TaskResult> => {
      const m = await lighthouse(ctx, screen, preset);
      const value = median(m.runs.map(pick));
      const min = await limit();
      const problems = failing ? failingOf(m.runs.map(failing)) : [];
      return {
        figure: `${value} (${runsOf(m, pick)})${problems.length ? `; failing: ${problems.join('; ')}` : ''}`,
        unit: '',
        target: `≥ ${min}`,
        met: value >= min,
        data: { preset, label, median: m, limit: min },
      };
    };
  const bareMobile = (ctx: BenchContext) => async () => (await lighthouse(ctx, BARE, 'mobile')).performance;
  const fixed = (n: number) => async () => n;
  const name = (what: string) => `Lighthouse ${what}: ${screen.name} (${screen.path})`;
  return [
    task(name('mobile performance'), '≥ bare app', (ctx) => score('mobile', 'performance', (r) => r.performance)(ctx, bareMobile(ctx))),
    task(name('mobile accessibility'), '≥ 95', (ctx) => score('mobile', 'accessibility', (r) => r.accessibility, (r) => r.failing.accessibility)(ctx, fixed(95))),
    task(name('mobile best practices'), '≥ 95', (ctx) => score('mobile', 'best practices', (r) => r.bestPractices, (r) => r.failing.bestPractices)(ctx, fixed(95))),
    task(name('desktop performance'), '≥ 90', (ctx) => score('desktop', 'performance', (r) => r.performance)(ctx, fixed(90))),
  ];
}

const bareJs = new Map<string, Promise<Loaded>>();
function measureJs(ctx: BenchContext, screen: Screen): Promise<Loaded> {
  if (!bareJs.has(screen.name)) {
    bareJs.set(screen.name, prepare(ctx).then((p) => firstScreenJs(screen === BARE ? p.bare : p.ours, screen, p.cookies)));
  }
  return bareJs.get(screen.name)!;
}

export const scenarios: BenchModule['scenarios'] = async () => [
  task('web builds (ours when changed, and the bare Expo Router app)', undefined, async (ctx) => {
    const p = await prepare(ctx);
    return { figure: `ours ${(p.buildMs.ours / 1000).toFixed(1)} s, bare app ${(p.buildMs.bare / 1000).toFixed(1)} s`, unit: '' };
  }),
  task('web first screen JavaScript: bare Expo Router app, same providers (/)', undefined, async (ctx) => {
    const js = await measureJs(ctx, BARE);
    return { figure: `${kb(js.sent)} sent as brotli (${kb(js.decoded)} decoded) in ${js.files} files`, unit: '', data: js };
  }),
  ...SCREENS.map((screen) =>
    task(`web first screen JavaScript: ${screen.name} (${screen.path})`, `≤ ${JS_RATIO_LIMIT}× bare app`, async (ctx) => {
      const [js, bare] = await Promise.all([measureJs(ctx, screen), measureJs(ctx, BARE)]);
      const ratio = js.sent / bare.sent;
      return {
        figure: `${kb(js.sent)} sent as brotli (${kb(js.decoded)} decoded) in ${js.files} files = ${ratio.toFixed(2)}× the bare app (decoded ${(js.decoded / bare.decoded).toFixed(2)}×)`,
        unit: '',
        target: `≤ ${JS_RATIO_LIMIT}× bare app`,
        met: ratio <= JS_RATIO_LIMIT,
        data: { ...js, bare, ratio },
      };
    }),
  ),
  task('Lighthouse mobile: bare Expo Router app (/)', undefined, async (ctx) => {
    const m = await lighthouse(ctx, BARE, 'mobile');
    return { figure: `performance ${m.performance} (${runsOf(m, (r) => r.performance)}), accessibility ${m.accessibility}, best practices ${m.bestPractices}; LCP ${m.lcpMs} ms, TBT ${m.tbtMs} ms`, unit: '', data: m };
  }),
  ...SCREENS.flatMap(lighthouseTasks),
];
