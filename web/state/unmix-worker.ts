/**
 * Pixel unmixing of a pilot image in a browser Web Worker, so the page stays responsive. Message in: `{type: 'run'}`
 * with the reference [channel][probe], the method, the image width and its planes (transferred, not copied). It
 * unmixes chunks of rows, posting `{type: 'progress', done, total}` (pixels) after each, then `{type: 'result'}` with
 * the abundance planes, the residual and the input planes handed back (all transferred), or `{type: 'error'}` with a
 * sentence. Cancelling is the page's `worker.terminate()`.
 */
import { allocateUnmixOutput, pixelUnmixer, SpectraError, type PixelUnmixMethod } from '../../spectra/index';

/** What the page posts to start a run. */
export interface UnmixRequest {
  type: 'run';
  referenceByChannel: number[][];
  method: PixelUnmixMethod;
  width: number;
  planes: Float32Array[];
}

/** What the worker posts back. */
export type UnmixWorkerMessage =
  | { type: 'progress'; done: number; total: number }
  | { type: 'result'; abundances: Float32Array[]; residual: Float32Array; planes: Float32Array[] }
  | { type: 'error'; message: string; planes: Float32Array[] };

/** Pixels per chunk: a progress message every ~64 k pixels (a few ms to tens of ms each; our convention). */
const CHUNK_PIXELS = 65_536;

const scope = self as unknown as DedicatedWorkerGlobalScope;

scope.onmessage = (event: MessageEvent<UnmixRequest>) => {
  const message = event.data;
  if (message?.type !== 'run') return;
  const post = (m: UnmixWorkerMessage, transfer: Transferable[] = []) => scope.postMessage(m, transfer);
  try {
    const { planes, width } = message;
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
    post({ type: 'result', abundances: out.abundances, residual: out.residual, planes }, [
      ...out.abundances.map((p) => p.buffer),
      out.residual.buffer,
      ...planes.map((p) => p.buffer),
    ]);
  } catch (err) {
    // The planes go back to the page, which keeps the image.
    const { planes } = message;
    const text = err instanceof SpectraError ? err.message : 'The unmixing stopped unexpectedly.';
    post(
      { type: 'error', message: text, planes },
      planes.map((p) => p.buffer),
    );
  }
};
