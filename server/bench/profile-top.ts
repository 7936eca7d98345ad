/**
 * Summarises a .cpuprofile written with BENCH_PROFILE=1: self time by function and by package or app folder, the
 * largest first. Usage: node_modules/.bin/tsx server/bench/profile-top.ts .bench/profile-<scenario>.cpuprofile [rows]
 */
import fs from 'node:fs';

type Node = { id: number; callFrame: { functionName: string; url: string; lineNumber: number }; hitCount?: number; children?: number[] };
type Profile = { nodes: Node[]; samples: number[]; timeDeltas: number[]; startTime: number; endTime: number };

const file = process.argv[2];
if (!file) throw new Error('Usage: profile-top.ts <file.cpuprofile> [rows]');
const rows = Number(process.argv[3] ?? 30);
const profile = JSON.parse(fs.readFileSync(file, 'utf8')) as Profile;
const byId = new Map(profile.nodes.map((n) => [n.id, n]));
const selfUs = new Map<number, number>();
profile.samples.forEach((id, i) => selfUs.set(id, (selfUs.get(id) ?? 0) + (profile.timeDeltas[i] ?? 0)));
const total = profile.endTime - profile.startTime;

const where = (url: string) => {
  const m = /node_modules\/((?:@[^/]+\/)?[^/]+)/.exec(url);
  if (m) return m[1];
  const app = /\/(server|shared|components)\/(.*)$/.exec(url);
  if (app) return `${app[1]}/${app[2]}`;
  return url ? url.replace(/^.*\//, '') : '(native)';
};
const add = (m: Map<string, number>, k: string, v: number) => m.set(k, (m.get(k) ?? 0) + v);
const fns = new Map<string, number>();
const places = new Map<string, number>();
for (const [id, us] of selfUs) {
  const { functionName, url, lineNumber } = byId.get(id)!.callFrame;
  add(fns, `${functionName || '(anonymous)'} ${where(url)}:${lineNumber + 1}`, us);
  add(places, url.startsWith('node:') || !url ? functionName.startsWith('(') ? functionName : `node internals` : where(url).split('/').slice(0, 2).join('/'), us);
}
const show = (title: string, m: Map<string, number>) => {
  console.log(`\n${title}`);
  for (const [k, us] of [...m].sort((a, b) => b[1] - a[1]).slice(0, rows)) console.log(`${((us / total) * 100).toFixed(1).padStart(5)}%  ${(us / 1000).toFixed(0).padStart(6)} ms  ${k}`);
};
console.log(`${file}: ${(total / 1000).toFixed(0)} ms profiled`);
show('Self time by place', places);
show('Self time by function', fns);
