/**
 * Unmixing a whole pilot image pixel by pixel (spectra/image) against numpy and scipy on the same pixels
 * (bench/numpy_unmix.py): 1024 × 1024 pixels × 8 channels × 6 probes, float32 planes (bench/unmix-image.ts). Run as
 * the page runs it: `unmixRange` over chunks of 64 rows. Least squares is paired run by run with numpy's batched
 * pinv @ Y (alternating order, both on one core; ratio = median of the pairs' ratios); NNLS is timed over the whole
 * image against scipy.optimize.nnls in a per-pixel loop, timed on a strided sample of 20,000 pixels and scaled to the
 * image. Memory: the process's peak resident size while unmixing, less its size before the image existed, over the
 * image's float32 size (image + output + scratch).
 */
import { rmSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { allocateUnmixOutput, pixelUnmixer, type PixelUnmixMethod } from '../../spectra/index';
import { pinToBenchCpu } from '../pin';
import { startPython } from '../python-child';
import type { BenchRow } from '../types';
import { IMAGE, benchPlanes, benchReference, writeForNumpy } from '../unmix-image';

const SCRIPT = fileURLToPath(new URL('../numpy_unmix.py', import.meta.url));
const ROWS_PER_CHUNK = 64;
const LS_PAIRS = 7;
const NNLS_RUNS = 3;
const SAMPLE_PIXELS = 20_000;

const median = (values: number[]) => {
  const sorted = values.toSorted((a, b) => a - b);
  const mid = sorted.length >> 1;
  return sorted.length % 2 === 1 ? sorted[mid] : (sorted[mid - 1] + sorted[mid]) / 2;
};
const round = (v: number | null, digits = 3) => (v === null || !Number.isFinite(v) ? null : Number(v.toFixed(digits)));
const row = (name: string, times: number[], extra: BenchRow['extra'], note?: string): BenchRow => ({
  suite: 'unmix',
  name,
  medianMs: times.length > 0 ? median(times) : null,
  minMs: times.length > 0 ? Math.min(...times) : null,
  maxMs: times.length > 0 ? Math.max(...times) : null,
  samples: times.length,
  extra,
  note,
});

export default async function unmixSuite(): Promise<BenchRow[]> {
  const rssBefore = process.memoryUsage.rss();
  const reference = benchReference();
  const planes = benchPlanes(reference);
  const pixels = IMAGE.width * IMAGE.height;
  const imageBytes = IMAGE.channels * pixels * 4;
  const out = allocateUnmixOutput(IMAGE.probes, pixels);
  let peakRss = process.memoryUsage.rss();
  const unmixMs = (method: PixelUnmixMethod) => {
    const start = performance.now();
    const unmixer = pixelUnmixer(reference, method);
    const chunk = ROWS_PER_CHUNK * IMAGE.width;
    for (let from = 0; from < pixels; from += chunk) {
      unmixer.unmixRange(planes, from, Math.min(pixels, from + chunk), out);
      peakRss = Math.max(peakRss, process.memoryUsage.rss());
    }
    return performance.now() - start;
  };
  const files = writeForNumpy(planes, reference);
  const unpin = pinToBenchCpu();
  const { child, note } = await startPython(
    SCRIPT,
    [files.planesPath, String(IMAGE.channels), String(pixels), files.refPath, String(SAMPLE_PIXELS)],
    unpin !== null,
  );
  const ask = async (command: string) => (child ? Number(await child.ask(command)) : NaN);
  unmixMs('leastSquares');
  if (child) await ask('pinv');
  const ours: number[] = [];
  const numpy: number[] = [];
  for (let pair = 0; pair < LS_PAIRS; pair++) {
    if (pair % 2 === 0 && child) numpy.push(await ask('pinv'));
    ours.push(unmixMs('leastSquares'));
    if (pair % 2 === 1 && child) numpy.push(await ask('pinv'));
  }
  const lstsq = child ? [await ask('lstsq'), await ask('lstsq'), await ask('lstsq')] : [];
  const nnls = Array.from({ length: NNLS_RUNS }, () => unmixMs('nnls'));
  const scipyAnswers = child ? [await child.ask('nnls'), await child.ask('nnls'), await child.ask('nnls')] : [];
  const scipy = scipyAnswers.filter((a) => a !== 'skip').map(Number);
  const numpyMemory = child ? await ask('mem') : NaN;
  child?.close();
  unpin?.();
  rmSync(files.planesPath, { force: true });
  rmSync(files.refPath, { force: true });
  const lsRatio = numpy.length > 0 ? median(ours.map((t, k) => t / numpy[k])) : null;
  const nnlsRatio = scipy.length > 0 ? median(nnls) / median(scipy) : null;
  const size = `${IMAGE.width}x${IMAGE.height} px x ${IMAGE.channels} ch x ${IMAGE.probes} probes`;
  const footprint = (peakRss - rssBefore) / imageBytes;
  return [
    row(
      `HEADLINE pixelUnmixer least squares, ${size}`,
      ours,
      {
        ratioToNumpyPinv: round(lsRatio),
        requirement: '<= 1.0 and <= 500 ms',
      },
      `${LS_PAIRS} runs, each paired with a numpy run in alternating order; ratio = median of the pairs' ratios`,
    ),
    row('numpy pinv(M) @ Y with residuals (float64), same pixels, paired runs', numpy, {}, note),
    row('numpy np.linalg.lstsq(M, Y) on the whole pixel matrix', lstsq, {
      ratioOursToLstsq: round(lstsq.length > 0 ? median(ours) / median(lstsq) : null),
    }),
    row(`HEADLINE pixelUnmixer NNLS (Lawson-Hanson per pixel), ${size}`, nnls, {
      ratioToScipyLoop: round(nnlsRatio),
      requirement: '< 0.2 and <= 3000 ms',
    }),
    row(
      'scipy.optimize.nnls per pixel in a Python loop, scaled from a sample',
      scipy,
      {},
      scipyAnswers.includes('skip')
        ? 'skipped: scipy is not installed'
        : `${SAMPLE_PIXELS} evenly strided pixels timed, scaled by ${pixels}/${SAMPLE_PIXELS}`,
    ),
    row(
      'memory: peak RSS growth while unmixing, over the image float32 size',
      [],
      {
        footprintTimesImage: round(footprint, 2),
        imageMiB: imageBytes / 2 ** 20,
        numpyPinvTimesImage: round(numpyMemory, 2),
        requirement: '<= 4',
      },
      'ours: image + output planes + scratch, from before the image existed; numpy: growth during its pinv and lstsq',
    ),
  ];
}
