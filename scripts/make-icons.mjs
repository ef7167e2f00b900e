// Renders the app icons in public/icons from their SVG sources (run after editing an SVG:
// `node scripts/make-icons.mjs`; the PNGs are committed, so builds do not need this).
import sharp from 'sharp';
import { join } from 'node:path';
import { root } from './setup.mjs';

const dir = join(root, 'public', 'icons');
const renders = [
  { source: 'icon.svg', size: 192, out: 'icon-192.png' },
  { source: 'icon.svg', size: 512, out: 'icon-512.png' },
  { source: 'maskable.svg', size: 512, out: 'maskable-512.png' },
  { source: 'maskable.svg', size: 180, out: 'apple-touch-180.png' },
];
for (const { source, size, out } of renders) {
  await sharp(join(dir, source), { density: 300 }).resize(size, size).png({ compressionLevel: 9 }).toFile(join(dir, out));
  console.log(`public/icons/${out}`);
}
