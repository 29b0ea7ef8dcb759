// The designer's verdict: usable only when every target's signal-to-noise after unmixing reaches the threshold
// (5 by default, Rose's criterion, J. Opt. Soc. Am. 1948; from memory) and the worst interference stays within its
// limit; otherwise no_usable_panel with the binding reason and the most targets that do work.
import { describe, expect, it } from 'vitest';
import { runDesign, type DesignRequest } from '../../../spectra/index';
import { verdictOf } from '../../../spectra/design/practice';

const thresholds = { minSignalToNoise: 5, maxInterference: 1 };
const quiet = { value: 0.01, from: 'a', into: 'b' };

describe('verdictOf', () => {
  it('is usable at S/N 5 and 40 with 1 % interference, and names the weakest target at S/N 4.9', () => {
    expect(verdictOf(['a', 'b'], [5, 40], quiet, thresholds)).toEqual({ verdict: 'usable', reason: '' });
    const low = verdictOf(['a', 'b'], [40, 4.9], quiet, thresholds);
    expect(low.verdict).toBe('no_usable_panel');
    expect(low.reason).toContain('b reaches a signal-to-noise of only 4.90');
  });

  it('names the pair when the worst interference is 150 % (above the 100 % limit) and S/N is fine', () => {
    const r = verdictOf(['a', 'b'], [20, 20], { value: 1.5, from: 'a', into: 'b' }, thresholds);
    expect(r.verdict).toBe('no_usable_panel');
    expect(r.reason).toContain('150 %');
  });

  it('counts a target with no figure (null) as below any threshold', () => {
    expect(verdictOf(['a', 'b'], [20, null], quiet, thresholds).verdict).toBe('no_usable_panel');
  });
});

const targets = (n: number): DesignRequest['targets'] =>
  Array.from({ length: n }, (_, i) => ({ name: `target ${i + 1}`, abundance: i % 3 === 2 ? 'low' : 'high' }));

describe('the verdict of free-mode designs', () => {
  it('12 targets under 405 nm: no_usable_panel with a reason, and a usable design for the largest count', () => {
    const request: DesignRequest = { targets: targets(12), excitation: [{ wavelengthNm: 405 }] };
    const result = runDesign(request);
    expect(result.verdict).toBe('no_usable_panel');
    expect(result.verdictReason.length).toBeGreaterThan(20);
    const k = result.largestUsableTargets!;
    expect(k).toBeGreaterThanOrEqual(1);
    expect(k).toBeLessThan(12);
    if (result.panel === null) expect(result.noise).toBeNull();
    // The most abundant k targets (high before low, in request order) do give a usable panel.
    const order = request.targets
      .map((t, i) => ({ t, i }))
      .sort((x, y) => (x.t.abundance === y.t.abundance ? x.i - y.i : x.t.abundance === 'high' ? -1 : 1))
      .slice(0, k)
      .sort((x, y) => x.i - y.i)
      .map((x) => x.t);
    const fewer = runDesign({ ...request, targets: order });
    expect(fewer.verdict).toBe('usable');
    fewer.noise!.signalToNoise.forEach((s) => expect(s!).toBeGreaterThanOrEqual(5));
  });

  it('a usable 5-target design has every S/N at or above 5 and its worst interference within 100 %', () => {
    const result = runDesign({ targets: targets(5), excitation: [{ wavelengthNm: 405 }] });
    expect(result.verdict).toBe('usable');
    expect(result.largestUsableTargets).toBeNull();
    result.noise!.signalToNoise.forEach((s) => expect(s!).toBeGreaterThanOrEqual(5));
    expect(result.objective!.worstInterference).toBeLessThanOrEqual(1);
  });
});
