/**
 * npm run admin -- --email someone@example.org [--name "Display name"]
 * Creates (or promotes) an admin account. The password comes from ADMIN_PASSWORD, or is generated and printed once.
 * Needs DATABASE_URL, or a running project database (npm start).
 */
import crypto from 'node:crypto';
import { execFileSync } from 'node:child_process';
import path from 'node:path';
import { parseArgs } from 'node:util';
import { loadConfig } from '../config';
import { createSequelize, migrate } from '../db';
import { ensureAdmin } from '../services/auth.service';

async function main() {
  const { values } = parseArgs({ options: { email: { type: 'string' }, name: { type: 'string' } } });
  if (!values.email) throw new Error('Usage: npm run admin -- --email someone@example.org [--name "Name"]');
  if (!process.env.DATABASE_URL) {
    process.env.DATABASE_URL = execFileSync('bash', [path.join(__dirname, '../scripts/pg.sh'), 'start']).toString().trim();
  }
  const config = loadConfig();
  const generated = !process.env.ADMIN_PASSWORD;
  const password = process.env.ADMIN_PASSWORD ?? crypto.randomBytes(12).toString('base64url');
  if (password.length < 10) throw new Error('ADMIN_PASSWORD must have at least 10 characters.');
  const sequelize = createSequelize(config.DATABASE_URL, { poolMax: 2 });
  try {
    await migrate(sequelize);
    const { created } = await ensureAdmin(config, values.email, password, values.name);
    console.log(`Admin ${values.email} ${created ? 'created' : 'promoted; password reset'}.`);
    if (generated) console.log(`Password (shown once, change it after signing in): ${password}`);
  } finally {
    await sequelize.close();
  }
}

main().catch((err) => {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
});
