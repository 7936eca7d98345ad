/**
 * npm run icons
 * Draws the PNG sizes the web build uses from the one source, assets/mark.svg (run again after changing it).
 * Rasterised by resvg (prebuilt binary from npm, works offline).
 */
import fs from 'node:fs';
import path from 'node:path';
import { Resvg } from '@resvg/resvg-js';

const ROOT = path.join(__dirname, '../..');

// Every PNG made from the mark, by path: the favicon, the app icon, and the web app manifest's icons (public/ is copied
// into the web build as it is).
const ICON_SIZES: Record<string, number> = {
  'assets/images/favicon.png': 48,
  'assets/images/icon.png': 512,
  'public/icon-192.png': 192,
  'public/icon-512.png': 512,
};

function main() {
  const svg = fs.readFileSync(path.join(ROOT, 'assets/mark.svg'), 'utf8');
  for (const [file, size] of Object.entries(ICON_SIZES)) {
    const png = new Resvg(svg, { fitTo: { mode: 'width', value: size } }).render().asPng();
    fs.writeFileSync(path.join(ROOT, file), png);
    console.log(`${file}: ${size} × ${size}`);
  }
}

main();
