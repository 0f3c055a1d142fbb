// Phone photos shrink before they are queued: a 12-megapixel slip is several MB, and over a weak signal at the
// counter a ~2,000 px JPEG reads just as well (the reader works at about that size) and travels as a few hundred kB.
// Plain browser APIs only, so the bench can run this very file in chromium.

/** The long edge a photo is brought down to, in pixels. */
export const PHOTO_LONG_EDGE = 2000;
/** JPEG quality of a downscaled photo (0..1): small print stays sharp. */
export const PHOTO_JPEG_QUALITY = 0.85;

/** The size to draw at, or null when the photo is already within the long edge (it is then sent as it is). */
export function downscaledSize(width: number, height: number, longEdge = PHOTO_LONG_EDGE): { width: number; height: number } | null {
  const long = Math.max(width, height);
  if (long <= longEdge) return null;
  const scale = longEdge / long;
  return { width: Math.max(1, Math.round(width * scale)), height: Math.max(1, Math.round(height * scale)) };
}

/**
 * A smaller JPEG of a large photo. PDFs, small photos and images the browser cannot decode (HEIC on most browsers:
 * the server converts those) come back untouched, as does a photo the JPEG would not make smaller.
 */
export async function downscalePhoto(file: File): Promise<File> {
  if (!file.type.startsWith('image/') || typeof createImageBitmap !== 'function') return file;
  let bitmap: ImageBitmap;
  try {
    // Turned upright from the photo's EXIF orientation: the JPEG written below carries no EXIF of its own.
    bitmap = await createImageBitmap(file, { imageOrientation: 'from-image' });
  } catch {
    return file;
  }
  try {
    const size = downscaledSize(bitmap.width, bitmap.height);
    if (!size) return file;
    const jpeg = await encodeJpeg(bitmap, size);
    if (!jpeg || jpeg.size >= file.size) return file;
    return new File([jpeg], file.name.replace(/\.[^.]*$/, '') + '.jpg', { type: 'image/jpeg', lastModified: file.lastModified });
  } finally {
    bitmap.close();
  }
}

async function encodeJpeg(bitmap: ImageBitmap, size: { width: number; height: number }): Promise<Blob | null> {
  const draw = (context: OffscreenCanvasRenderingContext2D | CanvasRenderingContext2D) => {
    // A PNG's transparent parts would turn black in a JPEG: paper white underneath.
    context.fillStyle = '#ffffff';
    context.fillRect(0, 0, size.width, size.height);
    context.imageSmoothingQuality = 'high';
    context.drawImage(bitmap, 0, 0, size.width, size.height);
  };
  if (typeof OffscreenCanvas !== 'undefined') {
    const canvas = new OffscreenCanvas(size.width, size.height);
    const context = canvas.getContext('2d');
    if (!context) return null;
    draw(context);
    return canvas.convertToBlob({ type: 'image/jpeg', quality: PHOTO_JPEG_QUALITY });
  }
  const canvas = document.createElement('canvas');
  canvas.width = size.width;
  canvas.height = size.height;
  const context = canvas.getContext('2d');
  if (!context) return null;
  draw(context);
  return new Promise((resolve) => canvas.toBlob(resolve, 'image/jpeg', PHOTO_JPEG_QUALITY));
}
