import request from 'supertest';
import type { Express } from 'express';
import type { Sequelize } from 'sequelize';
import { createApp } from '../../server/app';
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
