import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { loadConfig } from '../../server/config';

const base = { DATABASE_URL: 'postgres://x@127.0.0.1/db' };

describe('loadConfig', () => {
  it('generates a JWT secret once into the data directory and reuses it', () => {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'cw-config-'));

    const first = loadConfig({ ...base, DATA_DIR: dir });
    const second = loadConfig({ ...base, DATA_DIR: dir });

    expect(first.jwtSecret.length).toBeGreaterThanOrEqual(32);
    expect(second.jwtSecret).toBe(first.jwtSecret);
    expect(fs.statSync(path.join(dir, 'jwt-secret')).mode & 0o777).toBe(0o600);
  });

  it('refuses a bcrypt cost under 12 outside tests', () => {
    expect(() => loadConfig({ ...base, NODE_ENV: 'production', BCRYPT_COST: '8', JWT_SECRET: 'x'.repeat(40) })).toThrow(/BCRYPT_COST/);
  });

  it('defaults to bcrypt cost 12', () => {
    expect(loadConfig({ ...base, JWT_SECRET: 'x'.repeat(40) }).BCRYPT_COST).toBe(12);
  });

  it('lists a missing DATABASE_URL', () => {
    expect(() => loadConfig({})).toThrow(/DATABASE_URL/);
  });
});
