/**
 * Prints a bench run (.bench/latest.json, or the file named) as Markdown for the README: every endpoint with its
 * queries per request, p50/p97.5/p99, the ratios its target is checked on and whether they are met; then the tasks.
 * Usage: node_modules/.bin/tsx server/bench/report-md.ts [.bench/bench-<time>.json]
 */
import fs from 'node:fs';
import path from 'node:path';
import type { Check, Latency } from './targets';

type Run = {
  at: string;
  machine: string;
  http: { name: string; queries: number; latency: Latency; checks: Check[] }[];
  tasks: { name: string; figure: string; unit: string; target?: string; met?: boolean }[];
  met: number;
  of: number;
};

const file = process.argv[2] ?? path.resolve(__dirname, '../../.bench/latest.json');
const run = JSON.parse(fs.readFileSync(file, 'utf8')) as Run;
const ms = (n: number) => (Number.isFinite(n) ? (Math.round(n * 10) / 10).toString() : '—');
const checks = (c: Check[]) => (c.length ? c.map((x) => `${x.figure} ${x.ratio.toFixed(1)}× ≤ ${x.limit}×: ${x.met ? 'met' : '**not met**'}`).join('; ') : 'no target');
console.log(`${run.at} · ${run.machine} · ${run.met} of ${run.of} targets met\n`);
console.log('| endpoint | queries | p50 ms | p97.5 ms | p99 ms | against the floor |');
console.log('|---|---|---|---|---|---|');
for (const r of run.http) console.log(`| ${r.name.replace(/\|/g, '/')} | ${r.queries} | ${ms(r.latency.p50)} | ${ms(r.latency.p97_5)} | ${ms(r.latency.p99)} | ${checks(r.checks)} |`);
if (run.tasks.length) {
  console.log('');
  for (const t of run.tasks) console.log(`- ${t.name}: ${t.figure} ${t.unit}${t.target ? ` (target ${t.target}: ${t.met ? 'met' : '**not met**'})` : ''}`);
}
