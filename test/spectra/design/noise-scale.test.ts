// The design's noise on one photon scale: every probe and the sample's light scaled by one photons-per-unit factor
// (the brightest target's own signal = options.photons), recomputed here by a plain Poisson Monte Carlo (counts drawn
// with @stdlib/random-base-poisson, unmixed with ml-matrix's pseudo-inverse), independent of the library's noise code.
import { describe, expect, it } from 'vitest';
import { Matrix, pseudoInverse } from 'ml-matrix';
import poisson from '@stdlib/random-base-poisson';
import { runDesign, type DesignRequest } from '../../../spectra/index';

const request: DesignRequest = {
  targets: [
    { name: 'membrane', abundance: 'high' },
    { name: 'nucleus', abundance: 'high' },
    { name: 'rare cytoplasmic', abundance: 'low' },
    { name: 'vessel', abundance: 'medium' },
    { name: 'matrix', abundance: 'high' },
  ],
  excitation: [{ wavelengthNm: 405 }],
};

describe('design noise on one photon scale', () => {
  const result = runDesign(request);
  const n = request.targets.length;
  const collected = result.evaluation!.collected; // abundances inside, as in the signal model
  const abundance = result.panel!.probes.map((p) => p.abundance!);
  const own = abundance.map((_, t) => collected[t][t]);
  const k = 1000 / Math.max(...own); // photons per collected unit: the brightest target's own signal is 1,000
  const background = result.evaluation!.lineLeak.map(
    (row, c) => (result.evaluation!.backgroundCollected?.[c] ?? 0) + row.reduce((a, v) => a + v, 0),
  );

  it('the brightest target gets the 1,000 photons and the others their share on the same scale', () => {
    const brightest = own.indexOf(Math.max(...own));
    expect(result.noise!.photons[brightest]).toBeCloseTo(1000 / abundance[brightest], 6);
    own.forEach((x, t) => expect(result.noise!.photons[t]).toBeCloseTo((x * k) / abundance[t], 6));
  });

  it('each target SD matches a plain Poisson Monte Carlo of the panel within 5 standard errors (20,000 draws)', () => {
    const mean = collected.map((row) => row.reduce((a, x) => a + x * k, 0) + 0); // expected photons per channel
    const bg = background.map((b) => b * k);
    // M[c][p] photons per unit abundance; unmixing subtracts the known background first.
    const M = new Matrix(collected.map((row) => row.map((x, p) => (x * k) / abundance[p])));
    const pinv = pseudoInverse(M);
    const draws = 20_000;
    const rand = poisson.factory({ seed: 20261202 });
    const sum = new Array<number>(n).fill(0);
    const sumSq = new Array<number>(n).fill(0);
    for (let d = 0; d < draws; d++) {
      const y = mean.map((m, c) => rand(m + bg[c]) - bg[c]);
      const a = pinv.mmul(Matrix.columnVector(y)).to1DArray();
      a.forEach((v, t) => {
        sum[t] += v;
        sumSq[t] += v * v;
      });
    }
    for (let t = 0; t < n; t++) {
      const m = sum[t] / draws;
      const sd = Math.sqrt(sumSq[t] / draws - m * m);
      const predicted = result.noise!.sd[t]!;
      // The SD of a sample SD is about sd/√(2·draws).
      expect(Math.abs(sd - predicted), request.targets[t].name).toBeLessThan((5 * predicted) / Math.sqrt(2 * draws));
    }
  });
});
