/**
 * One Lighthouse run in its own process (so its trace analysis never shares the event loop of the server it
 * measures): `tsx server/bench/lighthouse-run.ts '<json>'` with { url, preset: 'mobile' | 'desktop', chromePath,
 * cookies? }. Launches Chromium headless with a fresh profile (chrome-launcher), sets the cookies (a signed-in
 * session) through puppeteer-core, runs Lighthouse 12 with the preset and prints one JSON line: the four category
 * scores (0–100), LCP and TBT, and the titles of the failing accessibility and best-practices audits.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';

export type LighthouseJob = {
  url: string;
  preset: 'mobile' | 'desktop';
  chromePath: string;
  cookies?: { name: string; value: string; path: string; httpOnly: boolean }[];
};

export type LighthouseScores = {
  performance: number;
  accessibility: number;
  bestPractices: number;
  lcpMs: number;
  tbtMs: number;
  finalUrl: string;
  failing: { accessibility: string[]; bestPractices: string[] };
  warnings: string[];
};

type Lhr = {
  finalDisplayedUrl: string;
  runWarnings: string[];
  runtimeError?: { code: string; message: string };
  categories: Record<string, { score: number | null; auditRefs: { id: string; weight: number }[] }>;
  audits: Record<string, { title: string; score: number | null; scoreDisplayMode: string; numericValue?: number }>;
};

function failingAudits(lhr: Lhr, category: string): string[] {
  return lhr.categories[category].auditRefs
    .map((ref) => ({ ref, audit: lhr.audits[ref.id] }))
    .filter(({ audit }) => audit && audit.score !== null && audit.score < 1 && audit.scoreDisplayMode !== 'informative' && audit.scoreDisplayMode !== 'notApplicable')
    .map(({ ref, audit }) => `${audit.title} (${ref.id})`);
}

async function run(job: LighthouseJob): Promise<LighthouseScores> {
  const { default: lighthouse } = await import('lighthouse');
  const chromeLauncher = await import('chrome-launcher');
  const { default: puppeteer } = await import('puppeteer-core');
  const profile = fs.mkdtempSync(path.join(os.tmpdir(), 'carbwright-lighthouse-'));
  const chrome = await chromeLauncher.launch({
    chromePath: job.chromePath,
    userDataDir: profile,
    chromeFlags: ['--headless=new', '--no-sandbox', '--disable-gpu', '--disable-dev-shm-usage', '--no-first-run', '--no-default-browser-check'],
  });
  try {
    const browser = await puppeteer.connect({ browserURL: `http://127.0.0.1:${chrome.port}`, defaultViewport: null });
    const page = await browser.newPage();
    if (job.cookies?.length) {
      const { hostname } = new URL(job.url);
      await page.setCookie(...job.cookies.map((c) => ({ ...c, domain: hostname, sameSite: 'Strict' as const, secure: false })));
    }
    const config = job.preset === 'desktop' ? (await import('lighthouse/core/config/desktop-config.js')).default : undefined;
    const result = await lighthouse(job.url, { port: chrome.port, output: 'json', logLevel: 'error', onlyCategories: ['performance', 'accessibility', 'best-practices'] }, config, page);
    await browser.disconnect();
    if (!result) throw new Error('Lighthouse returned no result');
    const lhr = result.lhr as unknown as Lhr;
    // An error page (server down, interstitial) scores, but is not the page asked for.
    if (lhr.runtimeError || !/^https?:/.test(lhr.finalDisplayedUrl)) throw new Error(`${job.url}: ${lhr.runtimeError?.message ?? lhr.runWarnings[0] ?? lhr.finalDisplayedUrl}`);
    const score = (id: string) => Math.round((lhr.categories[id]?.score ?? 0) * 100);
    return {
      performance: score('performance'),
      accessibility: score('accessibility'),
      bestPractices: score('best-practices'),
      lcpMs: Math.round(lhr.audits['largest-contentful-paint']?.numericValue ?? NaN),
      tbtMs: Math.round(lhr.audits['total-blocking-time']?.numericValue ?? NaN),
      finalUrl: lhr.finalDisplayedUrl,
      failing: { accessibility: failingAudits(lhr, 'accessibility'), bestPractices: failingAudits(lhr, 'best-practices') },
      warnings: lhr.runWarnings.map(String),
    };
  } finally {
    chrome.kill();
    fs.rmSync(profile, { recursive: true, force: true });
  }
}

if (require.main === module) {
  run(JSON.parse(process.argv[2]) as LighthouseJob)
    .then((scores) => {
      process.stdout.write(`${JSON.stringify(scores)}\n`);
      process.exit(0);
    })
    .catch((err) => {
      console.error((err as Error).stack ?? err);
      process.exit(1);
    });
}
