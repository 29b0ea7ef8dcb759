/**
 * Reads a pilot image in a browser Web Worker, so that decoding a large TIFF never freezes the page. Message in:
 * `{type: 'read', file}` (a Blob: posting one copies no bytes). It posts `{type: 'progress', done, total}` (pages)
 * after each decoded page, then `{type: 'image', image}` with the planes transferred (its `ome` still to be read from
 * `omeXml` on the page, which has the XML parser), or `{type: 'error', message}` with
 * the reader's sentence. Stopping is the page's `worker.terminate()`.
 */
import { ImageReadError } from '../io/image-read-error';
import { checkOmePlanes } from '../io/ome-xml';
import { readTiff, type PilotImage } from '../io/tiff-read';

/** What the page posts to read a file. */
export interface TiffReadRequest {
  type: 'read';
  file: Blob;
}

/** What the worker posts back. */
export type TiffWorkerMessage =
  | { type: 'progress'; done: number; total: number }
  | { type: 'image'; image: PilotImage }
  | { type: 'error'; message: string };

const scope = self as unknown as DedicatedWorkerGlobalScope;

scope.onmessage = async (event: MessageEvent<TiffReadRequest>) => {
  if (event.data?.type !== 'read') return;
  const post = (m: TiffWorkerMessage, transfer: Transferable[] = []) => scope.postMessage(m, transfer);
  try {
    const buffer = await event.data.file.arrayBuffer();
    const image = readTiff(buffer, {
      onPage: (done, total) => post({ type: 'progress', done, total }),
      // No XML parser here: a z-stack is refused by pattern before decoding, and the page reads the channels after.
      readOme: (xml) => (checkOmePlanes(xml), null),
    });
    post(
      { type: 'image', image },
      image.planes.map((p) => p.buffer),
    );
  } catch (err) {
    const message =
      err instanceof ImageReadError ? err.message : 'The file could not be read as an image: it may be damaged.';
    post({ type: 'error', message });
  }
};
