// The catalog designer's signal-to-noise objective against a brute force written in snr-reference.ts: every
// one-to-one assignment of 3 targets to small candidate sets, scored with the unmixing-noise model re-derived there
// with ml-matrix (npm reference library). Scenarios are fictional (imagined markers, no real lab or product).
import { describe, expect, it } from 'vitest';
import { runDesign, type ChannelSpec, type DesignRequest, type ProbeSpec } from '../../../spectra/index';
import {
  enumerateSnrDesigns,
  noiseFigures,
  proposalNoise,
  referenceOptions,
  type ReferenceOutcome,
  type ReferenceRequest,
} from './snr-reference';

/**
 * A bandpass channel, by default with the library's edges and blocking (FILTER_DEFAULTS: OD 6, 2 nm edges); a lower
 * OD or a steeper edge (10–90 % width, nm) when given.
 */
const bp = (centerNm: number, widthNm: number, blockingOD?: number, edgeWidthNm?: number): ChannelSpec => ({
  id: [
    `bp${centerNm}-${widthNm}`,
    blockingOD !== undefined ? `od${blockingOD}` : '',
    edgeWidthNm ? `e${edgeWidthNm}` : '',
  ]
    .filter(Boolean)
    .join('-'),
  filters: [
    {
      type: 'bandpass',
      centerNm,
      widthNm,
      ...(blockingOD !== undefined ? { blockingOD } : {}),
      ...(edgeWidthNm !== undefined ? { edgeWidthNm } : {}),
    },
  ],
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

/**
 * The ceiling binds here: the assignment with the best worst S/N overall puts 36 % of one probe's light into another
 * target's channel, more than the 20 % allowed (checked below).
 */
const ceilingCase = {
  name: '405 nm, abundances 1 / 0.3 / 0.1, 5 probes × 6 channels, interference at most 0.2',
  request: {
    targets: targets(1, 0.3, 0.1),
    excitation: line405,
    candidates: greenToRed,
    options: { maxInterference: 0.2 },
  } satisfies ReferenceRequest,
};

/**
 * Ties on purpose: three targets of abundance 1, 10⁵ background photons in the first target's channel, every filter at
 * OD 12. The first target must take the 700 nm CdTe dot, by far the brightest under 405 nm, to be the brightest target
 * (its own channel then holds the full 1000 photons): its S/N, 1000/√(1000 + 10⁵) ≈ 3.15 and the worst of the three,
 * is then the same to about 1e-12 whichever green dots and channels the other two take (what leaks between 700 nm and
 * the green at OD 12 is far below that). The designer must break the tie by the smaller total spreading.
 */
const tieCase = {
  name: '405 nm, abundances 1 / 1 / 1, 10⁵ background photons in the first channel, OD 12 filters (a tie on S/N)',
  request: {
    targets: targets(1, 1, 1),
    excitation: line405,
    candidates: {
      probes: [dot('cdte', 700), dot('cdse', 520), dot('cdse', 540), dot('cdse', 560), dot('cdse', 580)],
      channels: [bp(700, 40, 12), bp(530, 40, 12), bp(560, 40, 12), bp(585, 30, 12)],
    },
    // A usable verdict at S/N 3 keeps the designer from re-running on fewer targets (not under test here).
    options: { backgroundPhotons: [1e5, 0, 0], minSignalToNoise: 3 },
  } satisfies ReferenceRequest,
};

/**
 * Three CdTe and two CdSe dots in five bandpasses where the detector decides: with 30 e⁻ of read noise per channel (a
 * slow-scan camera's worst, common practice) or 1000 background photons, the best assignment is not the one of an
 * ideal detector (checked below), so a search that dropped either term would pick another panel.
 */
const detectorCandidates: ReferenceRequest['candidates'] = {
  probes: [dot('cdte', 610), dot('cdse', 540), dot('cdte', 620), dot('cdse', 560), dot('cdte', 630)],
  channels: [bp(595, 20), bp(565, 30), bp(600, 40), bp(540, 30), bp(660, 40)],
};
/**
 * The blocking check binds: with no scattered excitation (scatterLevel 0) an OD 5 600/40 channel would be the best
 * for the InP dot, but it does not block 405 nm to OD 6 (checked below).
 */
const blockingCase = {
  name: '405 nm, no scattered light, abundances 1 / 0.3 / 0.1, 4 probes × 5 channels, one of them OD 5',
  request: {
    targets: targets(1, 0.3, 0.1),
    excitation: line405,
    scatterLevel: 0,
    candidates: {
      probes: [dot('cdse', 540), dot('inp', 600), dot('cdte', 650), dot('cdse', 570)],
      channels: [bp(540, 30), bp(570, 30), bp(600, 40, 5), bp(607, 20), bp(655, 40)],
    },
  } satisfies ReferenceRequest,
};

/**
 * The clearance check binds: the 500 nm dot, 12 nm from the 488 nm line (15 nm needed), in a 510/30 channel with
 * 0.5 nm edges (which blocks 488 nm to OD 6 all the same) would give the best panel (checked below).
 */
const clearanceCase = {
  name: '405 + 488 nm, abundances 1 / 0.3 / 0.1, 4 probes × 4 channels, a dot 12 nm from the 488 nm line',
  request: {
    targets: targets(1, 0.3, 0.1),
    excitation: lines405and488,
    candidates: {
      probes: [dot('cdse', 500), dot('cdse', 545), dot('inp', 580), dot('cdte', 620)],
      channels: [bp(510, 30, undefined, 0.5), bp(545, 30), bp(580, 30), bp(625, 40)],
    },
  } satisfies ReferenceRequest,
};

const readNoiseCase = {
  name: '405 nm, abundances 1 / 0.3 / 0.1, 5 probes × 5 channels, read noise 30 e⁻',
  request: {
    targets: targets(1, 0.3, 0.1),
    excitation: line405,
    candidates: detectorCandidates,
    options: { readNoiseElectrons: 30 },
  } satisfies ReferenceRequest,
};
const backgroundCase = {
  name: '405 nm, abundances 1 / 0.3 / 0.1, 5 probes × 5 channels, 1000 background photons',
  request: {
    targets: targets(1, 0.3, 0.1),
    excitation: line405,
    candidates: detectorCandidates,
    options: { backgroundPhotons: 1000 },
  } satisfies ReferenceRequest,
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
  { name: ceilingCase.name, request: ceilingCase.request },
  { name: tieCase.name, request: tieCase.request },
  { name: readNoiseCase.name, request: readNoiseCase.request },
  { name: backgroundCase.name, request: backgroundCase.request },
  { name: blockingCase.name, request: blockingCase.request },
  { name: clearanceCase.name, request: clearanceCase.request },
];

/**
 * Four CdSe/InP dots 560–580 nm, four overlapping bandpasses, abundances 1 / 0.1 / 0.05: every probe is readable in
 * every channel, but any assignment puts more light of one probe into a rarer target's channel than its own.
 */
const crowded: ReferenceRequest = {
  targets: targets(1, 0.1, 0.05),
  excitation: line405,
  candidates: {
    probes: [dot('cdse', 560), dot('cdse', 570), dot('inp', 580), dot('cdse', 575)],
    channels: [bp(560, 40), bp(570, 40), bp(580, 40), bp(575, 50)],
  },
};

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

/** The reference outcome of each instance, enumerated once. */
const enumerated = new Map<ReferenceRequest, ReferenceOutcome>();
const referenceOf = (request: ReferenceRequest) => {
  if (!enumerated.has(request)) enumerated.set(request, enumerateSnrDesigns(request));
  return enumerated.get(request)!;
};
/** A figure the designer reports, which must be a number here. */
const figure = (x: number | null | undefined): number => {
  expect(typeof x).toBe('number');
  return x as number;
};

describe('runDesign (catalog) maximises the worst S/N: the exhaustive reference', () => {
  it.each(cases)(
    '%s: runDesign is exact and its objective.worstSignalToNoise equals the best over every assignment (1e-9)',
    (_name, request) => {
      const reference = referenceOf(request);
      expect(reference.best).not.toBeNull();
      const result = runDesign(request as DesignRequest);
      expect(result.exact).toBe(true);
      const worst = figure(result.objective!.worstSignalToNoise);
      expect(near(worst, reference.best!.figures.worstSignalToNoise, 1e-9)).toBe(true);
    },
  );

  it.each(cases)(
    "%s: runDesign's objective.worstSignalToNoise is the least of its own noise.signalToNoise (relative 1e-9)",
    (_name, request) => {
      const result = runDesign(request as DesignRequest);
      const least = Math.min(...result.noise!.signalToNoise.map(figure));
      expect(near(figure(result.objective!.worstSignalToNoise), least, 1e-9)).toBe(true);
    },
  );

  it.each(cases)(
    '%s: runDesign breaks ties by spreading: its totalSpreading is the least among assignments at the best S/N',
    (_name, request) => {
      const reference = referenceOf(request);
      const result = runDesign(request as DesignRequest);
      expect(near(figure(result.objective!.totalSpreading), reference.best!.figures.totalSpreading, 1e-9)).toBe(true);
    },
  );

  it.each(cases)(
    "%s: runDesign's weakestTarget has the lowest S/N of its proposal under the reference model, and its " +
      'interferenceCeiling is the option (default 1)',
    (_name, request) => {
      const result = runDesign(request as DesignRequest);
      const abundance = request.targets.map((t) => t.abundance);
      const o = referenceOptions(request.options);
      const { signalToNoise } = proposalNoise(result.evaluation!, abundance, o);
      const weakest = signalToNoise.indexOf(Math.min(...signalToNoise));
      expect(result.objective!.weakestTarget).toBe(request.targets[weakest].name);
      expect(result.objective!.interferenceCeiling).toBe(o.maxInterference);
    },
  );

  it('with interference at most 0.2 the ceiling binds: the optimum is below the unconstrained one and kept', () => {
    const request = ceilingCase.request;
    const reference = referenceOf(request);
    const unconstrained = Math.max(...reference.readable.map((s) => s.figures.worstSignalToNoise));
    const overCeiling = reference.readable.find((s) => s.figures.worstSignalToNoise === unconstrained)!;
    expect(overCeiling.worstInterference).toBeGreaterThan(0.2);
    expect(reference.best!.figures.worstSignalToNoise).toBeLessThan(unconstrained);
    const result = runDesign(request as DesignRequest);
    // I(t→u) = C[u][t] / C[u][u] of the proposal's own evaluation (abundances inside collected).
    const C = result.evaluation!.collected;
    C.forEach((row, u) => row.forEach((x, t) => t !== u && expect(x / row[u]).toBeLessThanOrEqual(0.2)));
    const worst = figure(result.objective!.worstSignalToNoise);
    expect(near(worst, reference.best!.figures.worstSignalToNoise, 1e-9)).toBe(true);
  });

  const binding = [
    { ...readNoiseCase, relaxed: 'an ideal detector', relax: {} },
    { ...backgroundCase, relaxed: 'no background', relax: {} },
    { ...blockingCase, relaxed: 'no blocking check', relax: { minBlockingOD: 0 } },
    { ...clearanceCase, relaxed: 'no line clearance', relax: { lineClearanceNm: 0 } },
  ].map((c) => [c.name, c.relaxed, c.request, c.relax] as const);
  it.each(binding)(
    '%s: the best assignment differs from that with %s, and runDesign proposes the best for the request',
    (_name, _relaxed, request, relax) => {
      const reference = referenceOf(request);
      const relaxed = referenceOf({ ...request, options: relax });
      const { probes, channels } = request.candidates;
      const pairs = (a: { probe: number[]; channel: number[] }) =>
        a.probe.map((p, t) => `${probes[p].id} in ${channels[a.channel[t]].id}`);
      expect(pairs(reference.best!)).not.toEqual(pairs(relaxed.best!));
      const result = runDesign(request as DesignRequest);
      expect(result.panel!.probes.map((p) => `${p.id} in ${p.channel}`)).toEqual(pairs(reference.best!));
    },
  );

  it('when S/N ties across assignments, runDesign proposes the probes and channels of least total spreading', () => {
    const request = tieCase.request;
    const reference = referenceOf(request);
    const top = reference.best!.figures.worstSignalToNoise;
    const tied = reference.feasible.filter((s) => s.figures.worstSignalToNoise >= top * (1 - 1e-9));
    // The tie is real: the assignments of the very highest S/N (ahead by a few parts in 1e12) spread 1.5 times more.
    const highest = Math.max(...tied.map((s) => s.figures.worstSignalToNoise));
    expect(reference.best!.figures.worstSignalToNoise).toBeLessThan(highest);
    const atHighest = tied.filter((s) => s.figures.worstSignalToNoise === highest).map((s) => s.figures.totalSpreading);
    expect(Math.min(...atHighest)).toBeGreaterThan(1.5 * reference.best!.figures.totalSpreading);
    const result = runDesign(request as DesignRequest);
    const { probes, channels } = request.candidates;
    const pairs = (probe: number[], channel: number[]) =>
      probe.map((p, t) => `${probes[p].id} in ${channels[channel[t]].id}`).sort();
    const proposed = result.panel!.probes.map((p) => `${p.id} in ${p.channel}`).sort();
    expect(proposed).toEqual(pairs(reference.best!.probe, reference.best!.channel));
  });

  it('four crowded dots at 405 nm: no assignment is within 100 % interference, so no_usable_panel, no panel', () => {
    const reference = referenceOf(crowded);
    expect(reference.readable.length).toBeGreaterThan(0);
    expect(reference.feasible).toHaveLength(0);
    const result = runDesign(crowded as DesignRequest);
    expect(result.verdict).toBe('no_usable_panel');
    expect(result.panel).toBeNull();
    expect(result.exact).toBe(true);
  });
});
