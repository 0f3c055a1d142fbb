// Draws the installable app's icons (our tally-mark badge: petrol blue, warm white marks, a brass stroke) from
// SVG into the PNG sizes a web app manifest asks for. Run once after a design change: node scripts/make-icons.mjs
import path from 'node:path';
import sharp from 'sharp';
import { ROOT } from './setup.mjs';

const PETROL = '#1d4c5d';
const MARKS = '#f6f0e9';
const BRASS = '#d5a345';

/** The marks on a 100-unit canvas; `inset` shrinks them towards the centre (maskable icons keep a safe zone). */
function badge({ rounded, inset }) {
  const scale = 1 - 2 * inset;
  const marks = [27, 42, 57, 72].map((x) => `<line x1="${x}" y1="27" x2="${x}" y2="73"/>`).join('');
  return `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 100 100">
    <rect width="100" height="100" rx="${rounded ? 24 : 0}" fill="${PETROL}"/>
    <g transform="translate(${50 * (1 - scale)} ${50 * (1 - scale)}) scale(${scale})">
      <g stroke="${MARKS}" stroke-width="8" stroke-linecap="round">${marks}</g>
      <line x1="17" y1="66" x2="83" y2="34" stroke="${BRASS}" stroke-width="9" stroke-linecap="round"/>
    </g>
  </svg>`;
}

const icons = [
  { name: 'icon-192.png', size: 192, rounded: true, inset: 0 },
  { name: 'icon-512.png', size: 512, rounded: true, inset: 0 },
  // Maskable: the launcher crops to its own shape, so the background fills the square and the marks stay inside
  // the middle 80 % (the safe zone of the W3C Web App Manifest's "maskable" purpose).
  { name: 'icon-maskable-192.png', size: 192, rounded: false, inset: 0.12 },
  { name: 'icon-maskable-512.png', size: 512, rounded: false, inset: 0.12 },
];

for (const icon of icons) {
  const file = path.join(ROOT, 'public', 'icons', icon.name);
  await sharp(Buffer.from(badge(icon)), { density: (72 * icon.size) / 100 }).resize(icon.size, icon.size).png({ compressionLevel: 9 }).toFile(file);
  console.log(`wrote ${path.relative(ROOT, file)}`);
}
