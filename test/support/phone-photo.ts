// A phone-like photo of a counter slip for capture tests and the bench: 4000 × 3000 JPEG, the generated slip laid
// on a noisy paper-and-bench background, so it compresses about as badly as a real camera picture does.
import { randomBytes } from 'node:crypto';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import sharp from 'sharp';

export const PHONE_PHOTO_SIZE = { width: 4000, height: 3000 };
const SLIP = path.resolve(__dirname, '../fixtures/receipts/generated/counter-1.png');

export async function phonePhoto(): Promise<Buffer> {
  const { width, height } = PHONE_PHOTO_SIZE;
  // Sensor-like grain: every byte a random grey-brown between 120 and 183.
  const grain = randomBytes(width * height * 3);
  for (let index = 0; index < grain.length; index += 1) grain[index] = 120 + (grain[index] & 63);
  const slip = await sharp(readFileSync(SLIP)).resize({ width: 2400 }).rotate(2, { background: '#8a7f70' }).toBuffer();
  return sharp(grain, { raw: { width, height, channels: 3 } })
    .composite([{ input: slip, gravity: 'center' }])
    .jpeg({ quality: 90 })
    .toBuffer();
}
