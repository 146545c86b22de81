// Makes the installed app's icons (public/icons/*.png) from Boreline's own mark, app/icon.svg (the same
// drawing as components/brand-mark.tsx). Run it after changing the mark: `node scripts/make-app-icons.mjs`;
// the PNGs are committed, so builds need nothing of this. sharp ships its prebuilt binary in the npm registry.
//   - "any" icons: the mark on a transparent square, as the SVG draws it;
//   - "maskable" icons: the mark at 80 % on the theme colour filling the square, so that a launcher's circle
//     or squircle mask (the safe zone is the centred circle of 80 % of the width, W3C Web App Manifest,
//     "purpose" member) never cuts into it;
//   - apple-touch-icon: iOS ignores the manifest's icons and draws no transparency, so a filled square.
import fs from 'node:fs';
import sharp from 'sharp';

const svg = fs.readFileSync(new URL('../app/icon.svg', import.meta.url));
const out = new URL('../public/icons/', import.meta.url);
fs.mkdirSync(out, { recursive: true });
const PAPER = '#fbfaf6';

async function plain(size, name) {
  await sharp(svg, { density: (72 * size) / 32 })
    .resize(size, size)
    .png({ compressionLevel: 9 })
    .toFile(new URL(name, out).pathname);
}

async function filled(size, name, scale, background) {
  const inner = Math.round(size * scale);
  const mark = await sharp(svg, { density: (72 * inner) / 32 })
    .resize(inner, inner)
    .png()
    .toBuffer();
  await sharp({ create: { width: size, height: size, channels: 4, background } })
    .composite([{ input: mark, gravity: 'centre' }])
    .png({ compressionLevel: 9 })
    .toFile(new URL(name, out).pathname);
}

for (const size of [96, 192, 512]) await plain(size, `boreline-${size}.png`);
for (const size of [192, 512]) await filled(size, `boreline-maskable-${size}.png`, 0.8, PAPER);
await filled(180, 'apple-touch-icon.png', 0.86, PAPER);
console.log('icons written to public/icons/');
// The same square as the page's apple-touch-icon link (Next.js's file convention, app/apple-icon.png).
await import('node:fs').then(({ copyFileSync }) =>
  copyFileSync(
    new URL('apple-touch-icon.png', out).pathname,
    new URL('../app/apple-icon.png', import.meta.url).pathname,
  ),
);
