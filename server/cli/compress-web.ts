/**
 * Run by server/scripts/build-web.sh after `expo export`: writes a brotli (.br) and a gzip (.gz) copy beside every
 * compressible file of the web build, once, so the server sends them as they are (server/web.ts) without compressing
 * per request. Usage: tsx server/cli/compress-web.ts <dist folder>
 */
import fs from 'node:fs';
import path from 'node:path';
import zlib from 'node:zlib';

const COMPRESSIBLE = /\.(js|css|html|json|svg|webmanifest|txt|ttf|otf|map)$/;
// Below this a compressed copy saves less than the extra round of headers costs.
const MIN_BYTES = 1024;

function* files(dir: string): Generator<string> {
  for (const entry of fs.readdirSync(dir, { withFileTypes: true })) {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) yield* files(full);
    else if (COMPRESSIBLE.test(entry.name)) yield full;
  }
}

function main() {
  const dist = process.argv[2];
  if (!dist || !fs.existsSync(dist)) throw new Error('usage: compress-web.ts <dist folder>');
  let before = 0;
  let br = 0;
  let gz = 0;
  for (const file of files(dist)) {
    const data = fs.readFileSync(file);
    if (data.length < MIN_BYTES) continue;
    const brotli = zlib.brotliCompressSync(data, { params: { [zlib.constants.BROTLI_PARAM_QUALITY]: 11, [zlib.constants.BROTLI_PARAM_SIZE_HINT]: data.length } });
    const gzip = zlib.gzipSync(data, { level: 9 });
    fs.writeFileSync(`${file}.br`, brotli);
    fs.writeFileSync(`${file}.gz`, gzip);
    before += data.length;
    br += brotli.length;
    gz += gzip.length;
  }
  const kb = (n: number) => `${Math.round(n / 1024)} KB`;
  console.log(`Compressed the web build: ${kb(before)} → ${kb(br)} brotli, ${kb(gz)} gzip.`);
}

main();
