import type { Sequelize } from 'sequelize';
import type { Config } from '../config';

export type BenchContext = {
  baseUrl: string;
  config: Config;
  sequelize: Sequelize;
  /** A signed-in member created for the benchmark: token and profile id. */
  member: { token: string; userId: number; profileId: number };
};

/**
 * Which target an endpoint is held to (issue 15): `read` p50 ≤ 3× and p99 ≤ 10× the floor's; `write` p50 ≤ 5×;
 * `search` p97.5 ≤ 3×; `none` is measured and printed without a target. Default: GET read, other methods write.
 */
export type TargetKind = 'read' | 'write' | 'search' | 'none';

/** One HTTP endpoint measured with autocannon. */
export type HttpScenario = {
  kind: 'http';
  name: string;
  method?: 'GET' | 'POST' | 'PUT';
  path: string;
  body?: unknown;
  auth?: boolean;
  target?: TargetKind;
};

/** What a task measured; `target` and `met` when it has a target of its own (the importer against COPY); `data` goes into the JSON only. */
export type TaskResult = { figure: string; unit: string; target?: string; met?: boolean; data?: unknown };

/** A measured piece of work that is not one request (e.g. an import): returns its own figures. */
export type TaskScenario = {
  kind: 'task';
  name: string;
  run: (ctx: BenchContext) => Promise<TaskResult>;
};

export type BenchModule = {
  /** Prepares data and returns what to measure; called once. */
  scenarios: (ctx: BenchContext) => Promise<(HttpScenario | TaskScenario)[]>;
};
