// Browser storage that jest's jsdom environment lacks, for the client specs (a jest setup file of the client project;
// outside src/ because it uses Node's own modules, which the app build must not see).
import { deserialize, serialize } from 'node:v8';
import 'fake-indexeddb/auto';

// fake-indexeddb copies values with structuredClone, which browsers and Node have and jsdom does not expose.
globalThis.structuredClone ??= <T>(value: T): T => deserialize(serialize(value));

// jsdom's Blob has no arrayBuffer(); browsers do, and the capture queue stores a photo's bytes with it. (This file is
// type-checked without the DOM library, hence the narrow FileReader type.)
interface JsdomFileReader {
  result: unknown;
  error: unknown;
  onload: () => void;
  onerror: () => void;
  readAsArrayBuffer(blob: Blob): void;
}
const { FileReader } = globalThis as unknown as { FileReader: new () => JsdomFileReader };
if (!Blob.prototype.arrayBuffer) {
  Blob.prototype.arrayBuffer = function (this: Blob) {
    return new Promise<ArrayBuffer>((resolve, reject) => {
      const reader = new FileReader();
      reader.onload = () => resolve(reader.result as ArrayBuffer);
      reader.onerror = () => reject(reader.error);
      reader.readAsArrayBuffer(this);
    });
  };
}
