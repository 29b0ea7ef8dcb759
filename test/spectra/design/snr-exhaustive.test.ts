// The catalog designer's signal-to-noise objective against a brute force written in snr-reference.ts: every
// one-to-one assignment of 3 targets to small candidate sets, scored with the unmixing-noise model re-derived there
// with ml-matrix (npm reference library). Scenarios are fictional (imagined markers, no real lab or product).
import { describe, expect, it } from 'vitest';
import { runDesign, type ChannelSpec, type DesignRequest, type ProbeSpec } from '../../../spectra/index';
import { noiseFigures, proposalNoise, referenceOptions, type ReferenceRequest } from './snr-reference';

/** A bandpass channel with the library's default edges and blocking (FILTER_DEFAULTS: OD 6, 2 nm edges). */
const bp = (centerNm: number, widthNm: number, blockingOD?: number): ChannelSpec => ({
  id: `bp${centerNm}-${widthNm}${blockingOD !== undefined ? `-od${blockingOD}` : ''}`,
  filters: [{ type: 'bandpass', centerNm, widthNm, ...(blockingOD !== undefined ? { blockingOD } : {}) }],
});
const dot = (material: 'cdse' | 'inp' | 'cdte', emissionPeakNm: number): ProbeSpec => ({
  id: `${material}-${emissionPeakNm}`,
  material,
  emissionPeakNm,
});
const targets = (...abundance: number[]) =>
  abundance.map((a, t) => ({ name: ['membrane marker', 'cytoplasm marker', 'rare nuclear marker'][t], abundance: a }));
const line405 = [{ wavelengthNm: 405 }];
const lines405and488 = [{ wavelengthNm: 405 }, { wavelengthNm: 488 }];

/** Five probes over 540–640 nm (CdSe, InP, CdTe) and six bandpasses, 405 nm excitation. */
const greenToRed: ReferenceRequest['candidates'] = {
  probes: [dot('cdse', 540), dot('cdse', 565), dot('inp', 600), dot('cdte', 640), dot('cdse', 580)],
  channels: [bp(540, 30), bp(565, 40), bp(585, 30), bp(605, 40), bp(640, 40), bp(660, 50)],
};

const instances: { name: string; request: ReferenceRequest }[] = [
  {
    name: '405 nm, abundances 1 / 0.3 / 0.1, 5 probes × 6 channels',
    request: { targets: targets(1, 0.3, 0.1), excitation: line405, candidates: greenToRed },
  },
  {
    // The 495 nm dot sits 7 nm from the 488 nm line (the clearance is 15 nm) and the OD 3 channel does not block
    // either line to OD 6: the reference and the designer must both leave them out.
    name: '405 + 488 nm, abundances 1 / 0.3 / 0.1, 5 probes × 5 channels (one dot near a line, one OD 3 channel)',
    request: {
      targets: targets(1, 0.3, 0.1),
      excitation: lines405and488,
      candidates: {
        probes: [dot('cdse', 525), dot('cdse', 495), dot('inp', 590), dot('cdte', 640), dot('cdse', 560)],
        channels: [bp(525, 30), bp(560, 40), bp(595, 40), bp(640, 40), bp(615, 40, 3)],
      },
    },
  },
  {
    name: '405 nm, abundances 1 / 1 / 0.1, 500 photons, 20 background photons, read noise 2, excess noise 2',
    request: {
      targets: targets(1, 1, 0.1),
      excitation: line405,
      candidates: {
        probes: [dot('cdse', 530), dot('inp', 575), dot('cdte', 620), dot('cdse', 600)],
        channels: [bp(530, 30), bp(555, 40), bp(580, 40), bp(605, 30), bp(625, 40)],
      },
      options: { photons: 500, backgroundPhotons: 20, readNoiseElectrons: 2, excessNoiseFactor: 2 },
    },
  },
  {
    name: '405 + 488 nm, abundances 0.5 / 0.1 / 0.1, 4 probes × 4 channels',
    request: {
      targets: targets(0.5, 0.1, 0.1),
      excitation: lines405and488,
      candidates: {
        probes: [dot('cdse', 520), dot('inp', 560), dot('inp', 610), dot('cdte', 660)],
        channels: [bp(520, 30), bp(560, 40), bp(610, 40), bp(660, 40)],
      },
    },
  },
];

/** |x − y| within a relative `tol` of y. */
const near = (x: number, y: number, tol: number) => Math.abs(x - y) <= tol * Math.abs(y);

describe('the noise model of the reference', () => {
  it('gives S/N 480000/17000 and 240000/19000 and the spreading worked by hand for a 2 × 2 mixing matrix', () => {
    // M = [[1000, 200], [100, 500]] photons at abundance 1, a = (1, 0.5), no background, F = 1, r = 0.
    // det M = 1000·500 − 200·100 = 480000, M⁻¹ = [[500, −200], [−100, 1000]] / 480000.
    // Channel variances v = M a: v_0 = 1000 + 200·0.5 = 1100, v_1 = 100 + 500·0.5 = 350.
    // Var(â_0) = (500²·1100 + 200²·350) / 480000² = 289e6 / 480000², SD = 17000 / 480000: S/N_0 = 480000 / 17000.
    // Var(â_1) = (100²·1100 + 1000²·350) / 480000² = 361e6 / 480000², SD = 19000 / 480000: S/N_1 = 0.5·480000/19000.
    // SS[0][1] = 1000·√((500²·200 + 200²·500) / 480000² / 500) = √140000 / 480;
    // SS[1][0] = 500·√((100²·1000 + 1000²·100) / 480000² / 1000) = √110000 / 960.
    const f = noiseFigures(
      [
        [1000, 200],
        [100, 500],
      ],
      [1, 0.5],
      [0, 0],
      1,
      0,
    );
    expect(f.signalToNoise[0]).toBeCloseTo(480000 / 17000, 10);
    expect(f.signalToNoise[1]).toBeCloseTo(240000 / 19000, 10);
    expect(f.worstSignalToNoise).toBeCloseTo(240000 / 19000, 10);
    expect(f.totalSpreading).toBeCloseTo(Math.sqrt(140000) / 480 + Math.sqrt(110000) / 960, 10);
  });

  it('with background 100 and 50 photons, excess noise 2 and read noise 3, adds F·b + r² to each channel', () => {
    // v_0 = 2·(1100 + 100) + 9 = 2409, v_1 = 2·(350 + 50) + 9 = 809 (same M and a as above).
    // Var(â_0) = (500²·2409 + 200²·809) / 480000²; Var(â_1) = (100²·2409 + 1000²·809) / 480000².
    // SS gains √F: each term under the root is multiplied by F = 2.
    const f = noiseFigures(
      [
        [1000, 200],
        [100, 500],
      ],
      [1, 0.5],
      [100, 50],
      2,
      3,
    );
    expect(f.signalToNoise[0]).toBeCloseTo(480000 / Math.sqrt(500 ** 2 * 2409 + 200 ** 2 * 809), 10);
    expect(f.signalToNoise[1]).toBeCloseTo((0.5 * 480000) / Math.sqrt(100 ** 2 * 2409 + 1000 ** 2 * 809), 10);
    expect(f.totalSpreading).toBeCloseTo(Math.SQRT2 * (Math.sqrt(140000) / 480 + Math.sqrt(110000) / 960), 10);
  });
});

const cases = instances.map((i) => [i.name, i.request] as const);

describe('runDesign (catalog) against the exhaustive signal-to-noise reference', () => {
  it.each(cases)(
    '%s: the designer reports the same per-target S/N for its proposal as the reference model (relative 1e-9)',
    (_name, request) => {
      const result = runDesign(request as DesignRequest);
      const abundance = request.targets.map((t) => t.abundance);
      const figures = proposalNoise(result.evaluation!, abundance, referenceOptions(request.options));
      result.noise!.signalToNoise.forEach((s, t) => expect(near(s!, figures.signalToNoise[t], 1e-9)).toBe(true));
    },
  );
});
