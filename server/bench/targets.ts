import type { TargetKind } from './types';

export type Latency = { rps: number; p50: number; p97_5: number; p99: number };

/** One target check: the figure as a multiple of the floor, the limit, and whether it is met. */
export type Check = { figure: string; limit: number; ratio: number; met: boolean };

// Only guards a division by zero; the floor is a few milliseconds with 10 connections.
const base = (ms: number) => Math.max(ms, 0.01);

/** The checks of issue 15 for one endpoint against the floor measured in the same run. */
export function checkTargets(kind: TargetKind, m: Latency, floor: Latency): Check[] {
  const check = (figure: string, value: number, floorValue: number, limit: number): Check => {
    const ratio = value / base(floorValue);
    return { figure, limit, ratio, met: ratio <= limit };
  };
  switch (kind) {
    case 'read':
      return [check('p50', m.p50, floor.p50, 3), check('p99', m.p99, floor.p99, 10)];
    case 'write':
      return [check('p50', m.p50, floor.p50, 5)];
    case 'search':
      return [check('p97.5', m.p97_5, floor.p97_5, 3)];
    case 'none':
      return [];
  }
}

/** "p50 2.4× ≤ 3× met" for the table. */
export function describeChecks(checks: Check[]): string {
  if (!checks.length) return 'no target';
  return checks.map((c) => `${c.figure} ${c.ratio.toFixed(1)}× ≤ ${c.limit}× ${c.met ? 'met' : 'NOT met'}`).join('; ');
}
