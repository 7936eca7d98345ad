import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { buildServiceWorker } from '../../server/lib/service-worker';

// Building the worker bundles Workbox (rollup and terser): slow on a shared machine; no timing is asserted.
jest.setTimeout(180_000);

// A tiny export as `expo export` leaves it, with the copies the compression step adds (which must not be precached).
const dist = fs.mkdtempSync(path.join(os.tmpdir(), 'cw-sw-'));
const files = {
  'index.html': '<!DOCTYPE html><html><body><div id="root"></div></body></html>',
  'manifest.webmanifest': '{"name":"Carbwright"}',
  'icon-192.png': 'png',
  '_expo/static/js/web/entry-abc123.js': 'console.log("entry")',
  '_expo/static/js/web/kitchen-def456.js': 'console.log("kitchen route")',
  '_expo/static/js/web/entry-abc123.js.br': 'brotli',
  'assets/node_modules/@expo-google-fonts/lora/400Regular/Lora_400Regular.0a1b2c.ttf': 'font',
  'metadata.json': '{}',
};
for (const [rel, text] of Object.entries(files)) {
  fs.mkdirSync(path.dirname(path.join(dist, rel)), { recursive: true });
  fs.writeFileSync(path.join(dist, rel), text);
}
afterAll(() => fs.rmSync(dist, { recursive: true, force: true }));

describe('the offline app shell at export', () => {
  let sw = '';
  beforeAll(async () => {
    await buildServiceWorker(dist);
    sw = fs.readFileSync(path.join(dist, 'sw.js'), 'utf8');
  });

  it.each([
    { file: 'index.html', precached: true },
    { file: 'manifest.webmanifest', precached: true },
    { file: 'icon-192.png', precached: true },
    { file: '_expo/static/js/web/entry-abc123.js', precached: true },
    { file: '_expo/static/js/web/kitchen-def456.js', precached: true },
    { file: 'assets/node_modules/@expo-google-fonts/lora/400Regular/Lora_400Regular.0a1b2c.ttf', precached: true },
    { file: '_expo/static/js/web/entry-abc123.js.br', precached: false },
    { file: 'metadata.json', precached: false },
  ])('$file precached: $precached', ({ file, precached }) => {
    expect(sw.includes(`"${file}"`)).toBe(precached);
  });

  it('answers app navigations with index.html but never /api, and has no route that caches API answers', () => {
    expect(sw).toContain('"/index.html"');
    expect(sw).toContain('denylist:[/^\\/api\\//]');
    // The deny rule is the only mention of /api: a runtime caching route for API answers would add another.
    expect(sw.match(/api/g)).toHaveLength(1);
  });
});
