/**
 * The unmix bench's synthetic image: 1024 × 1024 pixels, 8 channels, 6 probes with invented Gaussian signatures
 * over neighbouring channels (heavily overlapping, as in a dense panel). Each probe is present in a pixel with
 * probability 1/2 at an abundance uniform on [0, 1000) counts, and every channel's value is a Poisson count around
 * M · a, so least squares gives negative abundances where a probe is absent and NNLS has constraints to hold.
 */
import { writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { createRandom } from '../spectra/index';

export const IMAGE = { width: 1024, height: 1024, channels: 8, probes: 6 } as const;

/** The reference [channel][probe]: probe p peaks at channel 0.6 + 1.25 p with a Gaussian of SD 1.1 channels. */
export function benchReference(): number[][] {
  return Array.from({ length: IMAGE.channels }, (_, c) =>
    Array.from({ length: IMAGE.probes }, (_, p) => Math.exp(-0.5 * ((c - (0.6 + 1.25 * p)) / 1.1) ** 2)),
  );
}

/** The image's channel planes (float32), drawn from a fixed seed so every run unmixes the same pixels. */
export function benchPlanes(reference: number[][]): Float32Array[] {
  const pixels = IMAGE.width * IMAGE.height;
  const random = createRandom(20261203);
  const planes = Array.from({ length: IMAGE.channels }, () => new Float32Array(pixels));
  const a = new Float64Array(IMAGE.probes);
  for (let k = 0; k < pixels; k++) {
    for (let p = 0; p < IMAGE.probes; p++) a[p] = random.uniform() < 0.5 ? 0 : 1000 * random.uniform();
    for (let c = 0; c < IMAGE.channels; c++) {
      let mean = 0;
      for (let p = 0; p < IMAGE.probes; p++) mean += reference[c][p] * a[p];
      planes[c][k] = random.poisson(mean);
    }
  }
  return planes;
}

/** Writes the planes (channel after channel, raw float32) and the reference (JSON) for the numpy script. */
export function writeForNumpy(planes: Float32Array[], reference: number[][]): { planesPath: string; refPath: string } {
  const base = join(tmpdir(), `qdpanel-unmix-${process.pid}`);
  const bytes = new Uint8Array(planes.length * planes[0].byteLength);
  planes.forEach((plane, c) => bytes.set(new Uint8Array(plane.buffer), c * plane.byteLength));
  writeFileSync(`${base}.f32`, bytes);
  writeFileSync(`${base}.json`, JSON.stringify(reference));
  return { planesPath: `${base}.f32`, refPath: `${base}.json` };
}
