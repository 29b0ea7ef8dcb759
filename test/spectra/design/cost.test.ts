// The cost estimate of a design request (spectra/design/cost.ts): sizes read from the request alone, an upper bound
// on the free grid's real candidates, and the plan that refuses or shortens a request under the API's limits.
import { describe, expect, it } from 'vitest';
import { estimateDesignCost, LIMITS, planBoundedDesign, type DesignRequest } from '../../../spectra/index';
import { freeCatalog } from '../../../spectra/design/free-catalog';
import { resolveOptions } from '../../../spectra/design/options';
import { allowedMaterials } from '../../../spectra/design/request';
import { chunkNodesFor } from '../../../spectra/design/search';

const WORDS = ['high', 'low', 'medium'] as const;
const targets = (n: number) => Array.from({ length: n }, (_, i) => ({ name: `t${i}`, abundance: WORDS[i % 3] }));
const free = (n: number, options: DesignRequest['options'] = {}): DesignRequest => ({
  targets: targets(n),
  excitation: [{ wavelengthNm: 405 }],
  options,
});

function catalog(n: number, probes: number, channels: number, nodeBudget?: number): DesignRequest {
  return {
    targets: targets(n),
    excitation: [{ wavelengthNm: 405 }],
    candidates: {
      probes: Array.from({ length: probes }, (_, i) => ({ id: `d${i}`, material: 'cdse', emissionPeakNm: 500 + i })),
      channels: Array.from({ length: channels }, (_, i) => ({
        id: `c${i}`,
        filters: [{ type: 'bandpass', centerNm: 480 + 4 * i, widthNm: 20 }],
      })),
    },
    ...(nodeBudget === undefined ? {} : { options: { nodeBudget } }),
  };
}

describe('estimateDesignCost', () => {
  it('catalog mode counts the candidates plus the owned items, and one unit per target and pair a node', () => {
    const request = { ...catalog(4, 16, 64), owned: { probes: [{ id: 'mine', material: 'cdse' as const }] } };
    const cost = estimateDesignCost(request);
    expect([cost.candidateProbes, cost.candidateChannels]).toEqual([17, 64]);
    expect(cost.unitsPerNode).toBe(4 * 17 * 64);
    expect(cost.matrixUnits).toBe(17 * 64 * cost.gridPoints);
  });

  it('free mode counts no fewer probes and channels than the grid catalog the design builds', () => {
    for (const step of [10, 5, 3]) {
      const request = free(6, { peakStepNm: step, bandStepNm: step });
      const o = resolveOptions(request.options, true, 6);
      const built = freeCatalog(allowedMaterials(request, [400, 800]), [400, 800], request.excitation, o);
      const cost = estimateDesignCost(request);
      expect(cost.candidateProbes).toBeGreaterThanOrEqual(built.probes.length);
      expect(cost.candidateChannels).toBeGreaterThanOrEqual(built.channels.length);
      // An upper bound that stays close: within the channels the line and stock checks drop.
      expect(cost.candidateProbes).toBeLessThanOrEqual(built.probes.length * 1.5);
    }
  });

  it('a 1 nm free grid needs more working memory than the limit: 6 targets, and 16 targets', () => {
    for (const n of [6, 16]) {
      const cost = estimateDesignCost(free(n, { peakStepNm: 1, bandStepNm: 1, nodeBudget: 1 }));
      expect(cost.workingBytes).toBeGreaterThan(LIMITS.designBytes);
    }
  });
});

describe('planBoundedDesign', () => {
  it('refuses a 1 nm free grid for memory, saying the limit and how to get under it', () => {
    const plan = planBoundedDesign(estimateDesignCost(free(6, { peakStepNm: 1, bandStepNm: 1, nodeBudget: 5e6 })));
    expect(plan.refusal?.reason).toBe('memory');
    expect(plan.refusal?.message).toContain(`${LIMITS.designBytes / 2 ** 20} MiB`);
    expect(plan.refusal?.message).toMatch(/5 nm or more.*in the page/);
  });

  it('refuses for work a request whose fixed work leaves too few nodes, within a memory that would fit', () => {
    const cost = estimateDesignCost(catalog(16, 16, 64));
    const plan = planBoundedDesign(cost, { designWorkUnits: cost.fixedUnits, designBytes: LIMITS.designBytes });
    expect(plan.refusal?.reason).toBe('work');
  });

  it('shortens the largest node budget of 16 × 64 candidates so the planned work fits the limit', () => {
    const plan = planBoundedDesign(estimateDesignCost(catalog(16, 16, 64, LIMITS.nodeBudget)));
    expect(plan.refusal).toBeNull();
    expect(plan.shortened).toBe(true);
    expect(plan.nodeBudget).toBeLessThan(LIMITS.nodeBudget);
    expect(plan.nodeBudget).toBeGreaterThanOrEqual(64);
    expect(plan.plannedUnits).toBeLessThanOrEqual(LIMITS.designWorkUnits);
  });

  it('keeps the default node budget of a small catalog request that fits', () => {
    const plan = planBoundedDesign(estimateDesignCost(catalog(4, 8, 8)));
    expect(plan).toMatchObject({ refusal: null, shortened: false, nodeBudget: plan.nodesAsked });
  });
});

describe('chunkNodesFor', () => {
  it('gives about designChunkUnits of work a chunk, at least 1 node and at most the given most', () => {
    expect(chunkNodesFor(LIMITS.designChunkUnits / 10, 500)).toBe(10);
    expect(chunkNodesFor(LIMITS.designChunkUnits * 10, 500)).toBe(1);
    expect(chunkNodesFor(1, 500)).toBe(500);
  });
});
