import fs from 'node:fs';
import { ListObjectsV2Command, S3Client } from '@aws-sdk/client-s3';
import type { AddressInfo } from 'node:net';
import os from 'node:os';
import path from 'node:path';

type S3rverInstance = { run(): Promise<AddressInfo>; close(): Promise<void> };
type S3rverClass = new (options: Record<string, unknown>) => S3rverInstance;
// s3rver ships no types; this is the part of its API the tests use.
// eslint-disable-next-line @typescript-eslint/no-require-imports
const S3rver = require('s3rver') as S3rverClass;

export const FAKE_S3_BUCKET = 'carbwright-test';

/** The settings that point the app's S3 driver at the fake (s3rver accepts the key pair S3RVER/S3RVER). */
export type FakeS3 = { endpoint: string; dir: string; env: Record<string, string> };

/**
 * A local fake S3 (s3rver) on 127.0.0.1 and a free port, with one empty bucket, its files in a temporary folder:
 * started in beforeAll, closed and removed in afterAll. The returned object is filled in before the first test runs.
 */
export function useFakeS3(): FakeS3 {
  const fake = {} as FakeS3;
  let server: S3rverInstance | undefined;
  beforeAll(async () => {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'cw-s3-'));
    server = new S3rver({ address: '127.0.0.1', port: 0, silent: true, directory: dir, configureBuckets: [{ name: FAKE_S3_BUCKET, configs: [] }] });
    const { port } = await server.run();
    const endpoint = `http://127.0.0.1:${port}`;
    Object.assign(fake, {
      endpoint,
      dir,
      env: { STORAGE: 's3', S3_ENDPOINT: endpoint, S3_BUCKET: FAKE_S3_BUCKET, S3_REGION: 'us-east-1', S3_ACCESS_KEY_ID: 'S3RVER', S3_SECRET_ACCESS_KEY: 'S3RVER' },
    });
  });
  afterAll(async () => {
    await server?.close();
    if (fake.dir) fs.rmSync(fake.dir, { recursive: true, force: true });
  });
  return fake;
}

/** The keys of every object in the fake's bucket, sorted (read with a client of its own). */
export async function fakeS3Keys(fake: FakeS3): Promise<string[]> {
  const client = new S3Client({ region: 'us-east-1', endpoint: fake.endpoint, forcePathStyle: true, credentials: { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' } });
  try {
    const listed = await client.send(new ListObjectsV2Command({ Bucket: FAKE_S3_BUCKET }));
    return (listed.Contents ?? []).map((o) => o.Key!).sort();
  } finally {
    client.destroy();
  }
}
