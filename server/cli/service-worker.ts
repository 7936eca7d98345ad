/**
 * Run by server/scripts/build-web.sh after `expo export` and before compress-web.ts: writes the offline app shell's
 * service worker into the build (server/lib/service-worker.ts). Usage: tsx server/cli/service-worker.ts <dist folder>
 */
import fs from 'node:fs';
import { buildServiceWorker } from '../lib/service-worker';

async function main() {
  const dist = process.argv[2];
  if (!dist || !fs.existsSync(dist)) throw new Error('usage: service-worker.ts <dist folder>');
  const { count, size, warnings } = await buildServiceWorker(dist);
  for (const w of warnings) console.warn(`service worker: ${w}`);
  console.log(`Service worker: ${count} files precached (${Math.round(size / 1024)} KB).`);
}

main().catch((err: unknown) => {
  console.error(err);
  process.exit(1);
});
