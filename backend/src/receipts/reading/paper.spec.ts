// The paper finder on drawn pictures: rows of "print" (dark bars) on white, turned by a known angle or lit unevenly.
import sharp from 'sharp';
import type { Sharp } from 'sharp';
import { findPaper } from './paper';

/** A 600 x 900 white slip with 20 rows of 14 px high bars, as print rows. */
function slip(): Buffer {
  const bars = Array.from({ length: 20 }, (_, row) => `<rect x="60" y="${60 + row * 38}" width="${300 + (row % 3) * 80}" height="14" fill="#202020"/>`).join('');
  return Buffer.from(`<svg xmlns="http://www.w3.org/2000/svg" width="600" height="900"><rect width="600" height="900" fill="#ffffff"/>${bars}</svg>`);
}

async function layoutOf(picture: Sharp) {
  const { data, info } = await picture.greyscale().raw().toBuffer({ resolveWithObject: true });
  return findPaper(sharp(data, { raw: { width: info.width, height: info.height, channels: info.channels } }), info.width, info.height);
}

describe('findPaper', () => {
  it('measures a straight slip as straight, with the height of its rows', async () => {
    const layout = await layoutOf(sharp(slip()));
    expect(layout.skewDegrees).toBe(0);
    expect(layout.textHeight).toBe(14);
    expect(layout.unevenLight).toBe(false);
  });

  it.each([3, -2])('finds a slip turned by %d degrees, and the row height of the straightened rows', async (degrees) => {
    const turned = await sharp(slip()).rotate(degrees, { background: '#ffffff' }).png().toBuffer();
    const layout = await layoutOf(sharp(turned));
    expect(Math.abs(layout.skewDegrees - degrees)).toBeLessThanOrEqual(0.2);
    expect(layout.textHeight).toBeGreaterThanOrEqual(14);
    expect(layout.textHeight).toBeLessThanOrEqual(17);
  });

  it('tells a slip with a shadow over half of it from an evenly lit one', async () => {
    const shadow = Buffer.from('<svg xmlns="http://www.w3.org/2000/svg" width="600" height="900"><rect y="450" width="600" height="450" fill="#000000" fill-opacity="0.35"/></svg>');
    const layout = await layoutOf(sharp(slip()).composite([{ input: shadow }]));
    expect(layout.unevenLight).toBe(true);
  });
});
