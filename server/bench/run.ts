/**
 * npm run bench: starts the app on loopback against its own throwaway database and measures
 * requests per second and p50/p95/p99 latency with autocannon, beside the floor
 * (GET /api/bench/floor, a bare database round trip). Every server/bench/*.bench.ts adds scenarios.
 */
import fs from 'node:fs';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import { execFile } from 'node:child_process';
import { promisify } from 'node:util';
import request from 'supertest';
import { createApp } from '../app';
import { loadConfig } from '../config';
import { createSequelize, migrate } from '../db';
import type { BenchContext, BenchModule, HttpScenario, TaskScenario } from './types';

const SECONDS = Number(process.env.BENCH_SECONDS ?? 5);
const CONNECTIONS = Number(process.env.BENCH_CONNECTIONS ?? 10);

type Row = { name: string; rps: string; p50: string; p95: string; p99: string; ratio: string };

async function measure(baseUrl: string, s: HttpScenario, token: string) {
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
  return { rps: result.requests.average, p50: result.latency.p50, p95: result.latency.p97_5, p99: result.latency.p99 };
}

function printTable(rows: Row[]) {
  const head: Row = { name: 'scenario', rps: 'req/s', p50: 'p50 ms', p95: 'p97.5 ms', p99: 'p99 ms', ratio: 'req/s vs floor' };
  const all = [head, ...rows];
  const width = (k: keyof Row) => Math.max(...all.map((r) => r[k].length));
  const line = (r: Row) =>
    [r.name.padEnd(width('name')), ...(['rps', 'p50', 'p95', 'p99', 'ratio'] as const).map((k) => r[k].padStart(width(k)))].join('  ');
  console.log(`\n${line(head)}\n${'-'.repeat(line(head).length)}`);
  for (const r of rows) console.log(line(r));
}

async function main() {
  const config = loadConfig({ ...process.env, BENCH_ROUTES: '1', NODE_ENV: 'production', LOG_LEVEL: 'silent' });
  const sequelize = createSequelize(config.DATABASE_URL, { poolMax: 20 });
  await migrate(sequelize);
  const app = createApp(config, sequelize);
  const server = await new Promise<import('node:http').Server>((resolve) => {
    const s = app.listen(0, '127.0.0.1', () => resolve(s));
  });
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

  const scenarios: (HttpScenario | TaskScenario)[] = [{ kind: 'http', name: 'GET /api/me', path: '/api/me' }];
  const only = process.env.BENCH_ONLY;
  for (const file of fs.readdirSync(__dirname).filter((f) => f.endsWith('.bench.ts')).sort()) {
    if (only && !file.includes(only)) continue;
    const mod = (await import(path.join(__dirname, file))) as BenchModule;
    scenarios.push(...(await mod.scenarios(ctx)));
  }

  console.log(`Benchmark: ${SECONDS}s per scenario, ${CONNECTIONS} connections, loopback, ${new Date().toISOString()}`);
  const floor = await measure(baseUrl, { kind: 'http', name: 'floor', path: '/api/bench/floor', auth: false }, ctx.member.token);
  const fmt = (n: number) => (Math.round(n * 10) / 10).toString();
  const rows: Row[] = [{ name: 'floor: GET /api/bench/floor (SELECT 1)', rps: fmt(floor.rps), p50: fmt(floor.p50), p95: fmt(floor.p95), p99: fmt(floor.p99), ratio: '1.00' }];
  const tasks: string[] = [];
  for (const s of scenarios) {
    if (s.kind === 'task') {
      const { figure, unit } = await s.run(ctx);
      tasks.push(`${s.name}: ${figure} ${unit}`);
      continue;
    }
    const m = await measure(baseUrl, s, ctx.member.token);
    rows.push({ name: s.name, rps: fmt(m.rps), p50: fmt(m.p50), p95: fmt(m.p95), p99: fmt(m.p99), ratio: (m.rps / floor.rps).toFixed(2) });
  }
  printTable(rows);
  if (tasks.length) console.log(`\n${tasks.join('\n')}`);
  server.closeAllConnections();
  await new Promise((resolve) => server.close(resolve));
  await sequelize.close();
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
