import type { Sequelize } from 'sequelize';
import type { Config } from '../config';

export type BenchContext = {
  baseUrl: string;
  config: Config;
  sequelize: Sequelize;
  /** A signed-in member created for the benchmark: token and profile id. */
  member: { token: string; userId: number; profileId: number };
};

/** One HTTP endpoint measured with autocannon. */
export type HttpScenario = {
  kind: 'http';
  name: string;
  method?: 'GET' | 'POST' | 'PUT';
  path: string;
  body?: unknown;
  auth?: boolean;
};

/** A measured piece of work that is not one request (e.g. an import): returns its own figures. */
export type TaskScenario = {
  kind: 'task';
  name: string;
  run: (ctx: BenchContext) => Promise<{ figure: string; unit: string }>;
};

export type BenchModule = {
  /** Prepares data and returns what to measure; called once. */
  scenarios: (ctx: BenchContext) => Promise<(HttpScenario | TaskScenario)[]>;
};
