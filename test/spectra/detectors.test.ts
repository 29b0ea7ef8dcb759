import { describe, expect, it } from 'vitest';
import { errorOf } from './helpers/errors';
import {
  DEFAULT_GRID,
  DETECTOR_IDS,
  channelTransmission,
  detectorQe,
  filterTransmission,
  listDetectors,
} from '../../spectra/index';

describe('detectors', () => {
  it('listDetectors() names generic classes only, each with notes saying the curve is approximate', () => {
    const list = listDetectors();
    const ids = list.map((d) => d.id);
    expect(ids).toEqual(
      expect.arrayContaining(['ideal', 'pmt-bialkali', 'pmt-gaasp', 'hybrid-gaasp', 'scmos', 'emccd', 'si-apd']),
    );
    expect(new Set(ids).size).toBe(ids.length);
    for (const d of list.filter((d) => d.id !== 'ideal')) expect(d.notes).toMatch(/approximate/i);
  });

  it('detectorQe(id, grid) stays within 0–1 and is finite for every class', () => {
    for (const { id } of listDetectors()) {
      const qe = detectorQe(id, DEFAULT_GRID);
      expect(qe.length).toBe(DEFAULT_GRID.count);
      expect(qe.every((v) => Number.isFinite(v) && v >= 0 && v <= 1)).toBe(true);
    }
  });

  // Common practice (no single source): bialkali photocathodes are blue-sensitive and nearly blind in the deep red,
  // GaAsP cathodes peak in the green, silicon sensors keep useful QE in the near infrared.
  it('detectorQe ranks the classes as the trade knows them: bialkali blue, GaAsP green, silicon near-infrared', () => {
    const qe = (id: string, nm: number) => detectorQe(id, DEFAULT_GRID)[nm - DEFAULT_GRID.startNm];
    expect(qe('pmt-bialkali', 420)).toBeGreaterThan(10 * qe('pmt-bialkali', 680));
    expect(qe('pmt-gaasp', 520)).toBeGreaterThan(qe('pmt-bialkali', 520));
    expect(qe('scmos', 850)).toBeGreaterThan(qe('pmt-gaasp', 850));
    expect(qe('ideal', 999)).toBe(1);
  });

  it('channelTransmission(channel with detector) is the filter product times the detector QE, point by point', () => {
    const bp = { type: 'bandpass' as const, centerNm: 655, widthNm: 40 };
    const t = channelTransmission({ id: 'c', filters: [bp], detector: 'pmt-gaasp' }, DEFAULT_GRID);
    const f = filterTransmission(bp, DEFAULT_GRID);
    const qe = detectorQe('pmt-gaasp', DEFAULT_GRID);
    let checked = 0;
    for (let i = 0; i < t.length; i++) {
      expect(t[i]).toBeCloseTo(f[i] * qe[i], 15);
      if (qe[i] < 0.5 && f[i] > 0.5) checked++;
    }
    expect(checked).toBeGreaterThan(10);
  });

  it('detectorQe("photographic-plate") throws unknown_detector listing the known classes', () => {
    const err = errorOf(() => detectorQe('photographic-plate', DEFAULT_GRID));
    expect([err.code, err.path, err.message.includes(DETECTOR_IDS.join(', '))]).toEqual([
      'unknown_detector',
      ['detector'],
      true,
    ]);
  });
});
