import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import type { Express } from 'express';
import type { Sequelize } from 'sequelize';
import { createApp, stopApp } from '../../server/app';
import type { Config } from '../../server/config';
import type { Session } from '../../shared/schemas/auth';
import { openTestDatabase, testConfig } from './db';

export type TestContext = { app: Express; sequelize: Sequelize; config: Config };

/** A real app on this worker's freshly emptied database. */
export async function startTestApp(overrides: Record<string, string> = {}): Promise<TestContext> {
  const config = testConfig(overrides);
  const sequelize = await openTestDatabase();
  return { app: createApp(config, sequelize), sequelize, config };
}

/**
 * The one start-up for an API test file: the real app on this worker's freshly emptied database, started in
 * beforeAll and closed in afterAll. The returned object is filled in before the first test runs.
 */
export function useTestApp(overrides: Record<string, string> = {}): TestContext {
  const ctx = {} as TestContext;
  beforeAll(async () => {
    Object.assign(ctx, await startTestApp(overrides));
  });
  afterAll(async () => {
    if (ctx.app) await stopApp(ctx.app);
    await ctx.sequelize?.close();
  });
  return ctx;
}

/** A throwaway uploads folder for this test file (removed in afterAll), for `useTestApp({ UPLOADS_DIR })`. */
export function useUploadsDir(): string {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'cw-uploads-'));
  afterAll(() => fs.rmSync(dir, { recursive: true, force: true }));
  return dir;
}

let counter = 0;
/** Signs up a new member and returns the session (token, me). */
export async function signUpUser(app: Express, name = 'Tester'): Promise<Session & { email: string; password: string }> {
  counter += 1;
  const email = `${name.toLowerCase().replace(/\W+/g, '')}${counter}-${process.pid}@example.test`;
  const password = 'correct horse battery';
  const res = await request(app).post('/api/auth/sign-up').send({ email, displayName: name, password });
  if (res.status !== 201) throw new Error(`sign-up failed: ${res.status} ${JSON.stringify(res.body)}`);
  return { ...(res.body as Session), email, password };
}

export const bearer = (token: string) => ({ Authorization: `Bearer ${token}` });

/** Signs up a member and returns what most profile tests need: token, user id and their own profile id. */
export async function signUpMember(app: Express, name = 'Cook') {
  const session = await signUpUser(app, name);
  return { token: session.token, userId: session.me.user.id, profileId: session.me.profiles[0].id };
}
