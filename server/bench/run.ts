/**
 * npm run bench: starts the app on loopback against its own throwaway database filled with generated volume
 * (server/bench/volume.ts), and measures requests per second and p50/p97.5/p99 latency with autocannon beside the
 * floor (GET /api/bench/floor, a bare database round trip). Every server/bench/*.bench.ts adds scenarios. Each figure
 * is printed beside its target (server/bench/targets.ts) with the number of queries one request makes; the whole run
 * is written as JSON to .bench/ (git-ignored), with the rows and sizes of the largest tables. BENCH_ONLY=a,b runs the files
 * whose names contain any of the parts.
 */
import { AsyncLocalStorage } from 'node:async_hooks';
import { Session } from 'node:inspector/promises';
import fs from 'node:fs';
import { createServer } from 'node:http';
import type { AddressInfo } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { execFile } from 'node:child_process';
import { promisify } from 'node:util';
import request from 'supertest';
import { createApp } from '../app';
import { loadConfig } from '../config';
import { createSequelize, migrate } from '../db';
import { checkTargets, describeChecks, type Check, type Latency } from './targets';
import type { BenchContext, BenchModule, HttpScenario, TaskResult, TaskScenario } from './types';
import { DEFAULT_VOLUME, generateVolume } from './volume';

const SECONDS = Number(process.env.BENCH_SECONDS ?? 5);
const CONNECTIONS = Number(process.env.BENCH_CONNECTIONS ?? 10);
const OUT_DIR = path.resolve(__dirname, '../../.bench');

/**
 * BENCH_PROFILE=1: a CPU profile of the server's process while each scenario runs, written to
 * .bench/profile-<scenario>.cpuprofile (open it in Chromium's DevTools, or summarise it with server/bench/profile-top.ts).
 */
async function profiled<T>(name: string, run: () => Promise<T>): Promise<T> {
  if (process.env.BENCH_PROFILE !== '1') return run();
  const session = new Session();
  session.connect();
  await session.post('Profiler.enable');
  await session.post('Profiler.start');
  try {
    return await run();
  } finally {
    const { profile } = await session.post('Profiler.stop');
    fs.mkdirSync(OUT_DIR, { recursive: true });
    const slug = name.replace(/[^a-z0-9]+/gi, '-').replace(/^-|-$/g, '').slice(0, 60).toLowerCase();
    fs.writeFileSync(path.join(OUT_DIR, `profile-${slug}.cpuprofile`), JSON.stringify(profile));
    session.disconnect();
  }
}

type HttpResult = { name: string; path: string; method: string; queries: number; latency: Latency; checks: Check[] };

async function measure(baseUrl: string, s: HttpScenario, token: string): Promise<Latency> {
  // autocannon runs in its own process so it does not share the server's event loop.
  const args = ['-j', '-c', String(CONNECTIONS), '-d', String(SECONDS), '-m', s.method ?? 'GET'];
  if (s.auth !== false) args.push('-H', `authorization=Bearer ${token}`);
  if (s.body) args.push('-H', 'content-type=application/json', '-b', JSON.stringify(s.body));
  args.push(`${baseUrl}${s.path}`);
  const bin = path.join(__dirname, '../../node_modules/.bin/autocannon');
  const { stdout } = await promisify(execFile)(bin, args, { maxBuffer: 16 * 1024 * 1024 });
  const result = JSON.parse(stdout) as {
    non2xx: number;
    errors: number;
    requests: { average: number; total: number };
    latency: { p50: number; p97_5: number; p99: number };
  };
  const bad = result.non2xx + result.errors;
  if (bad > 0) throw new Error(`${s.name}: ${bad} failed requests of ${result.requests.total}`);
  if (result.requests.total === 0) throw new Error(`${s.name}: not one request finished in ${SECONDS} s`);
  return { rps: result.requests.average, p50: result.latency.p50, p97_5: result.latency.p97_5, p99: result.latency.p99 };
}

// Queries are counted per request: each request runs in its own async context, and a sequelize hook adds to it.
const requestQueries = new AsyncLocalStorage<{ n: number; sql?: string[] }>();
const COUNT_HEADER = 'x-bench-count';
let lastCounted = -1;
/** BENCH_SQL=1: prints the statements of the one request each scenario's query count comes from. */
const PRINT_SQL = process.env.BENCH_SQL === '1';
let lastSql: string[] = [];

/** Queries one request makes (requests still queued from the previous scenario do not count). */
async function countQueries(ctx: BenchContext, s: HttpScenario): Promise<number> {
  lastCounted = -1;
  const res = await fetch(`${ctx.baseUrl}${s.path}`, {
    method: s.method ?? 'GET',
    headers: { [COUNT_HEADER]: '1', ...(s.auth !== false ? { authorization: `Bearer ${ctx.member.token}` } : {}), ...(s.body ? { 'content-type': 'application/json' } : {}) },
    body: s.body ? JSON.stringify(s.body) : undefined,
  });
  await res.arrayBuffer();
  if (!res.ok) throw new Error(`${s.name}: ${res.status}`);
  if (PRINT_SQL) console.log(`\n${s.name}: ${lastCounted} queries\n${lastSql.map((q) => `  ${q}`).join('\n')}`);
  return lastCounted;
}

function printTable(rows: string[][]) {
  const width = rows[0].map((_, i) => Math.max(...rows.map((r) => r[i].length)));
  const line = (r: string[]) => r.map((c, i) => (i === 0 || i === r.length - 1 ? c.padEnd(width[i]) : c.padStart(width[i]))).join('  ');
  console.log(`\n${line(rows[0])}\n${'-'.repeat(line(rows[0]).length)}`);
  for (const r of rows.slice(1)) console.log(line(r));
}

type TableSize = { table: string; rows: number; totalBytes: number; indexBytes: number };

/** Rows and on-disk size (table + indexes + TOAST, and indexes alone) of the largest tables, for the README's growth arithmetic. */
async function tableSizes(ctx: BenchContext): Promise<TableSize[]> {
  // Vacuumed as well: the volume and the scenarios' fixtures are fresh inserts, and autovacuum would otherwise work
  // through them during the first measurements (on 2 cores it doubled the food searches' times in one run).
  await ctx.sequelize.query('VACUUM (ANALYZE)');
  const [rows] = await ctx.sequelize.query(
    `SELECT c.relname AS table, c.reltuples::bigint AS rows, pg_total_relation_size(c.oid) AS total, pg_indexes_size(c.oid) AS indexes
       FROM pg_class c JOIN pg_namespace n ON n.oid = c.relnamespace
      WHERE n.nspname = 'public' AND c.relkind = 'r' ORDER BY pg_total_relation_size(c.oid) DESC LIMIT 12`,
  );
  return (rows as { table: string; rows: string; total: string; indexes: string }[]).map((r) => ({ table: r.table, rows: Number(r.rows), totalBytes: Number(r.total), indexBytes: Number(r.indexes) }));
}

async function main() {
  const config = loadConfig({ ...process.env, BENCH_ROUTES: '1', NODE_ENV: 'production', LOG_LEVEL: 'silent' });
  const sequelize = createSequelize(config.DATABASE_URL, { poolMax: 20 });
  await migrate(sequelize);
  sequelize.addHook('beforeQuery', () => {
    const store = requestQueries.getStore();
    if (store) store.n += 1;
  });
  if (PRINT_SQL) (sequelize as unknown as { options: { logging: unknown } }).options.logging = (sql: string) => void requestQueries.getStore()?.sql?.push(sql.replace(/^Executing \([^)]*\): /, ''));
  const volume = process.env.BENCH_VOLUME === '0' ? null : await generateVolume(sequelize, DEFAULT_VOLUME);
  if (volume) console.log(`Volume: ${Object.entries(volume.counts).map(([k, v]) => `${v.toLocaleString('en')} ${k}`).join(', ')} (${(volume.ms / 1000).toFixed(1)} s)`);
  const app = createApp(config, sequelize);
  const server = createServer((req, res) => {
    const store: { n: number; sql?: string[] } = { n: 0, sql: req.headers[COUNT_HEADER] && PRINT_SQL ? [] : undefined };
    if (req.headers[COUNT_HEADER]) res.on('finish', () => ((lastCounted = store.n), (lastSql = store.sql ?? [])));
    requestQueries.run(store, () => app(req, res));
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const baseUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  const email = `bench-${Date.now()}@example.test`;
  const signUp = await request(app).post('/api/auth/sign-up').send({ email, displayName: 'Bench', password: 'bench password 123' });
  if (signUp.status !== 201) throw new Error(`bench sign-up failed: ${JSON.stringify(signUp.body)}`);
  const ctx: BenchContext = {
    baseUrl,
    config,
    sequelize,
    member: { token: signUp.body.token, userId: signUp.body.me.user.id, profileId: signUp.body.me.profiles[0].id },
  };

  const only = process.env.BENCH_ONLY;
  const scenarios: (HttpScenario | TaskScenario)[] = only ? [] : [{ kind: 'http', name: 'GET /api/me', path: '/api/me' }];
  for (const file of fs.readdirSync(__dirname).filter((f) => f.endsWith('.bench.ts')).sort()) {
    if (only && !only.split(',').some((part) => file.includes(part))) continue;
    const mod = (await import(path.join(__dirname, file))) as BenchModule;
    scenarios.push(...(await mod.scenarios(ctx)));
  }

  // Measured before the write scenarios add their own rows: the volume and the scenarios' fixtures only.
  const tables = await tableSizes(ctx);
  const machine = `${os.cpus().length} × ${os.cpus()[0]?.model ?? 'cpu'}, ${Math.round(os.totalmem() / 2 ** 30)} GiB, load ${os.loadavg().map((l) => l.toFixed(1)).join(' ')}`;
  console.log(`Benchmark: ${SECONDS}s per scenario, ${CONNECTIONS} connections, loopback, ${new Date().toISOString()}\nMachine: ${machine}`);
  const floorScenario: HttpScenario = { kind: 'http', name: 'floor: GET /api/bench/floor (SELECT 1)', path: '/api/bench/floor', auth: false, target: 'none' };
  // The floor is measured only when an endpoint is (BENCH_ONLY=web measures no endpoint).
  const anyHttp = scenarios.some((s) => s.kind === 'http');
  const floor = anyHttp ? await profiled(floorScenario.name, () => measure(baseUrl, floorScenario, ctx.member.token)) : { rps: 0, p50: 0, p97_5: 0, p99: 0 };
  const http: HttpResult[] = anyHttp
    ? [{ name: floorScenario.name, path: floorScenario.path, method: 'GET', queries: await countQueries(ctx, floorScenario), latency: floor, checks: [] }]
    : [];
  const tasks: ({ name: string } & TaskResult)[] = [];
  // Reads run before writes, so that a write scenario's rows (hundreds of batches or meals in 5 s) do not swell the
  // volume a read is labelled with ("inventory, 20+ batches").
  const isWrite = (s: HttpScenario | TaskScenario) => s.kind === 'http' && (s.method ?? 'GET') !== 'GET';
  const ordered = [...scenarios.filter((s) => !isWrite(s)), ...scenarios.filter(isWrite)];
  for (const s of ordered) {
    if (s.kind === 'task') {
      tasks.push({ name: s.name, ...(await s.run(ctx)) });
      continue;
    }
    const method = s.method ?? 'GET';
    const queries = await countQueries(ctx, s);
    const kind = s.target ?? (method === 'GET' ? 'read' : 'write');
    try {
      const latency = await profiled(s.name, () => measure(baseUrl, s, ctx.member.token));
      http.push({ name: s.name, path: s.path, method, queries, latency, checks: checkTargets(kind, latency, floor) });
    } catch (err) {
      // A scenario that fails or never finishes is a target not met, not the end of the run.
      const none = { rps: 0, p50: Infinity, p97_5: Infinity, p99: Infinity };
      http.push({ name: `${s.name} — ${(err as Error).message}`, path: s.path, method, queries, latency: none, checks: checkTargets(kind, none, floor) });
    }
  }
  const fmt = (n: number) => (Math.round(n * 10) / 10).toString();
  if (http.length) printTable([
    ['scenario', 'queries', 'req/s', 'p50 ms', 'p97.5 ms', 'p99 ms', 'p50 ×floor', 'target'],
    ...http.map((r) => [r.name, String(r.queries), fmt(r.latency.rps), fmt(r.latency.p50), fmt(r.latency.p97_5), fmt(r.latency.p99), (r.latency.p50 / floor.p50).toFixed(1), describeChecks(r.checks)]),
  ]);
  if (tasks.length) console.log(`\n${tasks.map((t) => `${t.name}: ${t.figure} ${t.unit}${t.target ? ` (target ${t.target}: ${t.met ? 'met' : 'NOT met'})` : ''}`).join('\n')}`);
  const mib = (n: number) => (n / 2 ** 20).toFixed(1);
  console.log(`\nLargest tables: ${tables.map((t) => `${t.table} ${t.rows.toLocaleString('en')} rows ${mib(t.totalBytes)} MiB (indexes ${mib(t.indexBytes)})`).join('; ')}`);
  const checks = [...http.flatMap((r) => r.checks), ...tasks.filter((t) => t.met !== undefined).map((t) => ({ met: t.met }))];
  const met = checks.filter((c) => c.met).length;
  console.log(`\nTargets met: ${met} of ${checks.length}`);
  fs.mkdirSync(OUT_DIR, { recursive: true });
  const stamp = new Date().toISOString().replace(/[:.]/g, '-');
  const report = { at: new Date().toISOString(), machine, seconds: SECONDS, connections: CONNECTIONS, volume: volume?.counts ?? null, tables, http, tasks, met, of: checks.length };
  fs.writeFileSync(path.join(OUT_DIR, `bench-${stamp}.json`), JSON.stringify(report, null, 2));
  fs.writeFileSync(path.join(OUT_DIR, 'latest.json'), JSON.stringify(report, null, 2));
  console.log(`Written: .bench/bench-${stamp}.json`);
  server.closeAllConnections();
  await new Promise((resolve) => server.close(resolve));
  await sequelize.close();
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
