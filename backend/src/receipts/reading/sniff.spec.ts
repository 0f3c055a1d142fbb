// Sniffing the real type of an upload from its bytes, and normalising photos (EXIF orientation, grey, size).
import sharp from 'sharp';
import { normaliseImage, MAX_WIDTH } from './normalise';
import { REFUSED_TYPE_MESSAGE, UnreadableDocumentError, sniffReceiptType } from './sniff';

const solid = (width: number, height: number) => sharp({ create: { width, height, channels: 3, background: { r: 250, g: 240, b: 210 } } });

describe('sniffReceiptType', () => {
  it('knows JPEG, PNG, WebP and PDF by their bytes, whatever the name', async () => {
    expect(await sniffReceiptType(await solid(8, 8).jpeg().toBuffer())).toBe('jpeg');
    expect(await sniffReceiptType(await solid(8, 8).png().toBuffer())).toBe('png');
    expect(await sniffReceiptType(await solid(8, 8).webp().toBuffer())).toBe('webp');
    expect(await sniffReceiptType(Buffer.from('%PDF-1.4\n1 0 obj\n<< >>\nendobj\n', 'latin1'))).toBe('pdf');
  });

  it('knows HEIC by its ftyp box (the brand iPhones write)', async () => {
    // ISO/IEC 14496-12 file type box: size, "ftyp", major brand "heic", minor version, compatible brands.
    const ftyp = Buffer.concat([Buffer.from([0, 0, 0, 0x18]), Buffer.from('ftypheic', 'latin1'), Buffer.alloc(4), Buffer.from('mif1heic', 'latin1')]);
    expect(await sniffReceiptType(Buffer.concat([ftyp, Buffer.alloc(64)]))).toBe('heic');
  });

  it('refuses a GIF, saying what it is and what is accepted', async () => {
    const gif = await solid(8, 8).gif().toBuffer();
    await expect(sniffReceiptType(gif)).rejects.toThrow(new UnreadableDocumentError(`${REFUSED_TYPE_MESSAGE} This one is image/gif.`));
  });

  it('refuses plain text, which has no signature', async () => {
    await expect(sniffReceiptType(Buffer.from('TOTAL 12.50'))).rejects.toThrow(REFUSED_TYPE_MESSAGE);
  });
});

describe('normaliseImage', () => {
  it('turns a photo upright from its EXIF orientation, greyscale, at most MAX_WIDTH wide', async () => {
    // Orientation 6: the camera was turned; the stored pixels are 3000 × 1000 and display as 1000 × 3000.
    const photo = await solid(3000, 1000).jpeg().withMetadata({ orientation: 6 }).toBuffer();
    const normalised = await normaliseImage(photo, 'jpeg');
    expect([normalised.width, normalised.height]).toEqual([1000, 3000]);
    const wide = await normaliseImage(await solid(4000, 1000).jpeg().toBuffer(), 'jpeg');
    expect([wide.width, wide.height]).toEqual([MAX_WIDTH, 500]);
    const metadata = await sharp(wide.png).metadata();
    expect([metadata.format, metadata.channels]).toEqual(['png', 1]);
  });

  it('enlarges a thumbnail so its text is tall enough to read', async () => {
    const small = await normaliseImage(await solid(400, 600).png().toBuffer(), 'png');
    expect([small.width, small.height]).toEqual([1200, 1800]);
  });

  it('refuses bytes that are not an image', async () => {
    await expect(normaliseImage(Buffer.from('not an image'), 'png')).rejects.toThrow();
  });
});
