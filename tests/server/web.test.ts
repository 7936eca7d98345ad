import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import zlib from 'node:zlib';
import express from 'express';
import request from 'supertest';
import { serveWeb } from '../../server/web';

// A tiny export as server/scripts/build-web.sh leaves it: files with their brotli and gzip copies beside them.
const dist = fs.mkdtempSync(path.join(os.tmpdir(), 'cw-web-'));
const bundle = `console.log(${JSON.stringify('x'.repeat(4000))});`;
const html = '<!DOCTYPE html><html><body><div id="root"><main>Carbwright</main></div></body></html>';
const write = (rel: string, text: string) => {
  const file = path.join(dist, rel);
  fs.mkdirSync(path.dirname(file), { recursive: true });
  fs.writeFileSync(file, text);
  fs.writeFileSync(`${file}.br`, zlib.brotliCompressSync(text));
  fs.writeFileSync(`${file}.gz`, zlib.gzipSync(text));
};
write('_expo/static/js/web/entry-abc123.js', bundle);
write('index.html', html);
fs.writeFileSync(path.join(dist, 'manifest.webmanifest'), '{"name":"Carbwright"}');
write('sw.js', `self.addEventListener('fetch', () => {}); // ${'precache '.repeat(200)}`);

const app = express();
serveWeb(app, dist);
afterAll(() => fs.rmSync(dist, { recursive: true, force: true }));

const JS = '/_expo/static/js/web/entry-abc123.js';

describe('serving the web build', () => {
  it.each([
    { name: 'brotli when the browser takes it', accept: 'gzip, deflate, br', encoding: 'br' },
    { name: 'gzip when it takes only gzip', accept: 'gzip', encoding: 'gzip' },
  ])('sends the copy made at export: $name', async ({ accept, encoding }) => {
    const res = await request(app).get(JS).set('Accept-Encoding', accept).buffer(true).parse((r, done) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => done(null, Buffer.concat(chunks)));
    });

    expect(res.status).toBe(200);
    expect(res.headers['content-encoding']).toBe(encoding);
    expect(res.headers['content-type']).toMatch(/javascript/);
    expect(res.headers.vary).toMatch(/Accept-Encoding/);
    expect(res.headers['cache-control']).toBe('public, max-age=31536000, immutable');
    expect(Number(res.headers['content-length'])).toBeLessThan(bundle.length / 4);
  });

  it('sends the plain file to a client that takes no compression', async () => {
    const res = await request(app).get(JS).set('Accept-Encoding', 'identity');

    expect(res.status).toBe(200);
    expect(res.headers['content-encoding']).toBeUndefined();
    expect(res.text).toBe(bundle);
  });

  it('answers client routes with index.html compressed and always revalidated', async () => {
    const res = await request(app).get('/kitchen/batches/3').set('Accept', 'text/html').set('Accept-Encoding', 'br');

    expect(res.status).toBe(200);
    expect(res.headers['content-encoding']).toBe('br');
    expect(res.headers['cache-control']).toBe('no-cache');
    expect(res.headers['content-type']).toMatch(/text\/html/);
  });

  it.each([
    { name: 'its brotli copy', accept: 'br', encoding: 'br' },
    { name: 'the plain file', accept: 'identity', encoding: undefined },
  ])('revalidates the service worker on every visit, never keeps it a year: $name', async ({ accept, encoding }) => {
    const res = await request(app).get('/sw.js').set('Accept-Encoding', accept);

    expect(res.status).toBe(200);
    expect(res.headers['content-encoding']).toBe(encoding);
    expect(res.headers['content-type']).toMatch(/javascript/);
    expect(res.headers['cache-control']).toBe('no-cache');
  });

  it('revalidates the manifest and never serves a path outside the build', async () => {
    const manifest = await request(app).get('/manifest.webmanifest');
    const outside = await request(app).get('/..%2f..%2fetc%2fpasswd').set('Accept', 'application/json');

    expect(manifest.headers['cache-control']).toBe('no-cache');
    expect(manifest.headers['content-type']).toMatch(/manifest\+json/);
    expect(outside.status).toBe(404);
  });
});
