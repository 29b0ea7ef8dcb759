/**
 * Pixel unmixing of a pilot image in a browser Web Worker, so the page stays responsive. Message in: `{type: 'run'}`
 * with the reference [channel][probe], the method, the image width, its pages (transferred, not copied) and the page
 * each channel reads. It unmixes chunks of rows, posting `{type: 'progress', done, total}` (pixels) after each, then
 * `{type: 'result'}` with the abundance planes, the residual and the pages handed back (all transferred), or
 * `{type: 'error'}` with a sentence and the pages. Cancelling is the page's `worker.terminate()`.
 */
import { allocateUnmixOutput, pixelUnmixer, SpectraError, type PixelUnmixMethod } from '../../spectra/index';

/** What the page posts to start a run. */
export interface UnmixRequest {
  type: 'run';
  referenceByChannel: number[][];
  method: PixelUnmixMethod;
  width: number;
  /** Every page of the image; a page appears once here even when two channels read it. */
  pages: Float32Array[];
  /** The page index each channel reads, in the reference's channel order. */
  pageOfChannel: number[];
}

/** What the worker posts back. */
export type UnmixWorkerMessage =
  | { type: 'progress'; done: number; total: number }
  | { type: 'result'; abundances: Float32Array[]; residual: Float32Array; pages: Float32Array[] }
  | { type: 'error'; message: string; pages: Float32Array[] };

/** Pixels per chunk: a progress message every ~64 k pixels (a few ms to tens of ms each; our convention). */
const CHUNK_PIXELS = 65_536;

const scope = self as unknown as DedicatedWorkerGlobalScope;

scope.onmessage = (event: MessageEvent<UnmixRequest>) => {
  const message = event.data;
  if (message?.type !== 'run') return;
  const post = (m: UnmixWorkerMessage, transfer: Transferable[] = []) => scope.postMessage(m, transfer);
  try {
    const { pages, width } = message;
    const planes = message.pageOfChannel.map((i) => pages[i]);
    const unmixer = pixelUnmixer(message.referenceByChannel, message.method);
    const total = planes[0]?.length ?? 0;
    const out = allocateUnmixOutput(unmixer.probes, total);
    // Whole rows per chunk, so progress moves down the image.
    const rowsPerChunk = Math.max(1, Math.floor(CHUNK_PIXELS / width));
    for (let from = 0; from < total;) {
      const to = Math.min(total, from + rowsPerChunk * width);
      unmixer.unmixRange(planes, from, to, out);
      from = to;
      post({ type: 'progress', done: from, total });
    }
    post({ type: 'result', abundances: out.abundances, residual: out.residual, pages }, [
      ...out.abundances.map((p) => p.buffer),
      out.residual.buffer,
      ...pages.map((p) => p.buffer),
    ]);
  } catch (err) {
    // The pages go back to the page, which keeps the image.
    const { pages } = message;
    const text = err instanceof SpectraError ? err.message : 'The unmixing stopped unexpectedly.';
    post(
      { type: 'error', message: text, pages },
      pages.map((p) => p.buffer),
    );
  }
};
