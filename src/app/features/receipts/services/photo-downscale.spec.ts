// Downscaling before a capture is queued: the size it draws at, and what it leaves alone. The drawing itself needs
// a real browser; the bench runs this file in chromium on a 4000 × 3000 photo.
import { downscaledSize, downscalePhoto } from './photo-downscale';

describe('downscaledSize', () => {
  it.each([
    { width: 4000, height: 3000, expected: { width: 2000, height: 1500 } },
    { width: 3024, height: 4032, expected: { width: 1500, height: 2000 } },
    { width: 2001, height: 10, expected: { width: 2000, height: 10 } },
    { width: 9000, height: 1, expected: { width: 2000, height: 1 } },
  ])('brings $width × $height to a long edge of 2000 px', ({ width, height, expected }) => {
    expect(downscaledSize(width, height)).toEqual(expected);
  });

  it('keeps a photo already within the long edge as it is', () => {
    expect(downscaledSize(2000, 1500)).toBeNull();
    expect(downscaledSize(640, 480)).toBeNull();
  });
});

describe('downscalePhoto', () => {
  it('hands a PDF back untouched', async () => {
    const pdf = new File(['%PDF-1.7'], 'invoice.pdf', { type: 'application/pdf' });
    expect(await downscalePhoto(pdf)).toBe(pdf);
  });

  it('hands a photo back untouched where the browser cannot decode it', async () => {
    const heic = new File(['not decodable here'], 'IMG_0042.HEIC', { type: 'image/heic' });
    (globalThis as { createImageBitmap?: unknown }).createImageBitmap = () => Promise.reject(new DOMException('unsupported', 'InvalidStateError'));
    try {
      expect(await downscalePhoto(heic)).toBe(heic);
    } finally {
      delete (globalThis as { createImageBitmap?: unknown }).createImageBitmap;
    }
  });
});
