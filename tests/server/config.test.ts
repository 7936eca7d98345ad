import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { loadConfig, trustProxy } from '../../server/config';

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

  it('keeps photos on local disk unless told otherwise', () => {
    expect(loadConfig({ ...base, JWT_SECRET: 'x'.repeat(40) }).STORAGE).toBe('disk');
  });

  const s3 = { STORAGE: 's3', S3_BUCKET: 'photos', S3_REGION: 'eu-west-1' };
  it.each([
    { name: 'no bucket', env: { ...s3, S3_BUCKET: undefined }, message: /S3_BUCKET is required when STORAGE=s3/ },
    { name: 'no region', env: { ...s3, S3_REGION: undefined }, message: /S3_REGION is required when STORAGE=s3/ },
    { name: 'a key id without its secret', env: { ...s3, S3_ACCESS_KEY_ID: 'id' }, message: /S3_SECRET_ACCESS_KEY: S3_ACCESS_KEY_ID and S3_SECRET_ACCESS_KEY go together/ },
    { name: 'a secret without its key id', env: { ...s3, S3_SECRET_ACCESS_KEY: 'secret' }, message: /S3_ACCESS_KEY_ID: S3_ACCESS_KEY_ID and S3_SECRET_ACCESS_KEY go together/ },
    { name: 'an endpoint that is not a URL', env: { ...s3, S3_ENDPOINT: 'minio:9000' }, message: /S3_ENDPOINT must be an http\(s\) URL/ },
    { name: 'an unknown storage', env: { STORAGE: 'ftp' }, message: /STORAGE/ },
  ])('refuses STORAGE settings with $name, naming the setting', ({ env, message }) => {
    expect(() => loadConfig({ ...base, JWT_SECRET: 'x'.repeat(40), ...env })).toThrow(message);
  });

  it('accepts S3 storage with a bucket and region, credentials from the SDK or as a pair', () => {
    expect(loadConfig({ ...base, JWT_SECRET: 'x'.repeat(40), ...s3 }).STORAGE).toBe('s3');
    expect(loadConfig({ ...base, JWT_SECRET: 'x'.repeat(40), ...s3, S3_ACCESS_KEY_ID: 'id', S3_SECRET_ACCESS_KEY: 'secret' }).S3_FORCE_PATH_STYLE).toBe('1');
  });

  it.each([
    { value: undefined, expected: false },
    { value: '1', expected: 1 },
    { value: 'loopback', expected: 'loopback' },
    { value: '10.0.0.0/8, loopback', expected: '10.0.0.0/8, loopback' },
  ])('reads TRUST_PROXY=$value as $expected', ({ value, expected }) => {
    expect(trustProxy(loadConfig({ ...base, JWT_SECRET: 'x'.repeat(40), TRUST_PROXY: value }))).toBe(expected);
  });

  it('refuses a TRUST_PROXY that is neither a hop count nor addresses', () => {
    expect(() => loadConfig({ ...base, JWT_SECRET: 'x'.repeat(40), TRUST_PROXY: 'yes please' })).toThrow(/TRUST_PROXY is a hop count/);
  });
});
