/**
 * npm run icons
 * Draws the PNG sizes the web build uses from the one source, assets/mark.svg (run again after changing it).
 * Rasterised by resvg (prebuilt binary from npm, works offline).
 */
import fs from 'node:fs';
import path from 'node:path';
import { Resvg } from '@resvg/resvg-js';

const ASSETS = path.join(__dirname, '../../assets');

// Every PNG made from the mark, by file name: the favicon and the app icon.
const ICON_SIZES: Record<string, number> = { 'favicon.png': 48, 'icon.png': 512 };

function main() {
  const svg = fs.readFileSync(path.join(ASSETS, 'mark.svg'), 'utf8');
  for (const [file, size] of Object.entries(ICON_SIZES)) {
    const png = new Resvg(svg, { fitTo: { mode: 'width', value: size } }).render().asPng();
    fs.writeFileSync(path.join(ASSETS, 'images', file), png);
    console.log(`assets/images/${file}: ${size} × ${size}`);
  }
}

main();
