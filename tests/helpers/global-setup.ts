/**
 * Runs once per jest run: migrates the template database that npm test created, imports the shipped food tables
 * (IFCT 2017 and USDA SR28) and keeps a copy of them and of the synonym table in the schema `shipped` (test files
 * empty the public tables and restore from it; see db.ts), then clones the template into one database per jest
 * worker, so test files in parallel never share tables.
 */
import { Client } from 'pg';
import { createSequelize, migrate } from '../../server/db';
import { ensureDefaultDatasets } from '../../server/services/imports.service';
import { SHIPPED_TABLES } from './db';

export const WORKER_DATABASES = 4;

export default async function globalSetup() {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error('DATABASE_URL is not set: run the tests through `npm test`.');
  const sequelize = createSequelize(url, { poolMax: 2 });
  await migrate(sequelize);
  await ensureDefaultDatasets(sequelize);
  await sequelize.query('DROP SCHEMA IF EXISTS shipped CASCADE; CREATE SCHEMA shipped;');
  for (const table of SHIPPED_TABLES) await sequelize.query(`CREATE TABLE shipped.${table} AS TABLE public.${table}`);
  await sequelize.close();
  const template = new URL(url).pathname.slice(1);
  const admin = new Client({ connectionString: url.replace(/\/[^/]*$/, '/postgres') });
  await admin.connect();
  try {
    for (let i = 1; i <= WORKER_DATABASES; i++) {
      await admin.query(`DROP DATABASE IF EXISTS "${template}_w${i}" WITH (FORCE)`);
      await admin.query(`CREATE DATABASE "${template}_w${i}" TEMPLATE "${template}"`);
    }
  } finally {
    await admin.end();
  }
}
