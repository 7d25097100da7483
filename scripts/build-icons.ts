// Draws the app's icons (PNG, for the web app manifest) from one design: a rounded asphalt square
// with a vest-coloured check mark. The maskable one fills the square and keeps the mark inside the
// central safe circle (80 % of the side) that launchers leave uncut. Run: npx tsx scripts/build-icons.ts
import path from 'node:path';
import sharp from 'sharp';

const asphalt = '#111316';
const vest = '#c6f432';

function svg({ maskable }: { maskable: boolean }): string {
  // The check sits in the middle 60 % for the maskable icon, a little larger on the plain one.
  const scale = maskable ? 0.72 : 1;
  const offset = (1 - scale) * 256;
  const corner = maskable ? 0 : 104;
  return `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 512 512">
  <rect width="512" height="512" rx="${corner}" fill="${asphalt}"/>
  <g transform="translate(${offset} ${offset}) scale(${scale})">
    <path d="M128 268 L216 356 L392 164" stroke="${vest}" stroke-width="64" fill="none"
      stroke-linecap="round" stroke-linejoin="round"/>
  </g>
</svg>`;
}

const out = path.join(process.cwd(), 'public', 'icons');
const jobs: [string, number, boolean][] = [
  ['icon-192.png', 192, false],
  ['icon-512.png', 512, false],
  ['icon-maskable-512.png', 512, true],
  ['apple-touch-icon.png', 180, true],
];
for (const [name, size, maskable] of jobs) {
  await sharp(Buffer.from(svg({ maskable })))
    .resize(size, size)
    .png({ compressionLevel: 9 })
    .toFile(path.join(out, name));
  console.log(`${name} ${size}×${size}`);
}
