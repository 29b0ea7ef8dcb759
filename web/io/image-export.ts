/**
 * The files an unmixed pilot image gives: the abundance maps (and the residual) as a multi-page 32-bit float TIFF,
 * and the per-region means as CSV (the same cell guard as the ordering sheet).
 */
import { csvText, type CsvValue } from './csv-export';
import { writeTiff } from './tiff-write';

/** One plane of the download and the words its page's ImageDescription holds. */
export interface NamedPlane {
  description: string;
  plane: Float32Array;
}

/** The planes as one TIFF, one 32-bit float page each (SampleFormat 3), in order. */
export function abundanceTiff(width: number, height: number, planes: readonly NamedPlane[]): Uint8Array<ArrayBuffer> {
  return writeTiff(
    planes.map(({ description, plane }) => ({
      width,
      height,
      bitsPerSample: 32,
      sampleFormat: 'float',
      data: plane,
      // TIFF 6.0 ASCII: anything else in a label becomes '?'.
      description: description.replace(/[^\x20-\x7e]/g, '?'),
    })),
  );
}

/** One measured region: where it is, what it is labelled, and per channel its mean and sd over n pixels. */
export interface MeasuredRegion {
  label: string;
  x: number;
  y: number;
  width: number;
  height: number;
  mean: number[];
  sd: number[];
  n: number;
}

/** The region means as CSV: one row per region, a mean and an sd column per channel (named by `channels`). */
export function regionMeansCsv(channels: readonly string[], regions: readonly MeasuredRegion[]): string {
  const rows: CsvValue[][] = [
    [
      'region',
      'label',
      'x px',
      'y px',
      'width px',
      'height px',
      'pixels',
      ...channels.map((c) => `mean ${c}`),
      ...channels.map((c) => `sd ${c}`),
    ],
    ...regions.map((r, i) => [i + 1, r.label, r.x, r.y, r.width, r.height, r.n, ...r.mean, ...r.sd]),
  ];
  return csvText(rows);
}
