// Finds the real type of an uploaded receipt from its bytes (never its name) and refuses anything else.
import { importEsm } from './esm-import';

export const ACCEPTED_TYPES = ['jpeg', 'png', 'webp', 'heic', 'pdf'] as const;
export type ReceiptFileType = (typeof ACCEPTED_TYPES)[number];

export const REFUSED_TYPE_MESSAGE = 'This file is not a receipt we can read. Send a photo (JPEG, PNG, WebP or HEIC) or a PDF.';

/** A document the reader cannot take; its message tells the person what to send instead. */
export class UnreadableDocumentError extends Error {
  override readonly name = 'UnreadableDocumentError';
}

interface FileTypeModule {
  fileTypeFromBuffer(buffer: Uint8Array): Promise<{ ext: string; mime: string } | undefined>;
}

const BY_EXTENSION: Record<string, ReceiptFileType> = { jpg: 'jpeg', png: 'png', webp: 'webp', heic: 'heic', pdf: 'pdf' };

export async function sniffReceiptType(bytes: Uint8Array): Promise<ReceiptFileType> {
  const { fileTypeFromBuffer } = await importEsm<FileTypeModule>('file-type');
  const found = await fileTypeFromBuffer(bytes);
  // file-type names HEIC by its mime type (image/heic, image/heif) and extension "heic".
  const type = found ? (BY_EXTENSION[found.ext] ?? (/^image\/hei[cf]/.test(found.mime) ? 'heic' : undefined)) : undefined;
  if (!type) throw new UnreadableDocumentError(found ? `${REFUSED_TYPE_MESSAGE} This one is ${found.mime}.` : REFUSED_TYPE_MESSAGE);
  return type;
}
