import { describe, expect, it } from 'vitest';
import { cmfs } from 'spectral-color';
import { converter } from 'culori';
import {
  cie1931Cmf,
  isNearInfrared,
  wavelengthToCss,
  wavelengthToDisplayRgb,
  xyzToLinearSrgb,
} from '../../web/chart/color';

const toLrgb = converter('lrgb');

describe('wavelength colours', () => {
  // Reference: the CIE 1931 2° table (CIE 015:2018) as shipped in the spectral-color package.
  it('cie1931Cmf(λ) stays within 0.035 of the CIE 1931 2° table from 400 to 700 nm', () => {
    let worst = 0;
    for (let nm = 400; nm <= 700; nm += 5) {
      const ref = cmfs.CIE_1931_2DEG.sampleAt(nm);
      const fit = cie1931Cmf(nm);
      for (let k = 0; k < 3; k++) worst = Math.max(worst, Math.abs(fit[k] - ref[k]));
    }
    // Wyman, Sloan, Shirley (JCGT 2013) report the multi-lobe fit's error as comparable to the table's own precision.
    expect(worst).toBeLessThan(0.035);
  });

  it('cie1931Cmf(555) gives ȳ within 0.01 of 1, the peak of the photopic curve (CIE 1931 table)', () => {
    expect(cie1931Cmf(555)[1]).toBeCloseTo(cmfs.CIE_1931_2DEG.sampleAt(555)[1], 1);
    expect(Math.abs(cie1931Cmf(555)[1] - 1)).toBeLessThan(0.01);
  });

  // Reference: culori's XYZ D65 → linear sRGB conversion, an independent implementation of IEC 61966-2-1.
  it('xyzToLinearSrgb(xyz) agrees with culori to 1e-3 for colours across the spectrum', () => {
    for (const nm of [450, 520, 580, 620]) {
      const [x, y, z] = cie1931Cmf(nm);
      const ref = toLrgb({ mode: 'xyz65', x, y, z });
      const ours = xyzToLinearSrgb([x, y, z]);
      expect(ours[0]).toBeCloseTo(ref.r, 3);
      expect(ours[1]).toBeCloseTo(ref.g, 3);
      expect(ours[2]).toBeCloseTo(ref.b, 3);
    }
  });

  it('wavelengthToDisplayRgb(580) is yellowish: red and green high, blue low', () => {
    const [r, g, b] = wavelengthToDisplayRgb(580);
    expect(r).toBeGreaterThan(0.8);
    expect(g).toBeGreaterThan(0.6);
    expect(b).toBeLessThan(0.5);
  });

  it('wavelengthToDisplayRgb(450) is bluish: blue the brightest channel, red and green well below it', () => {
    const [r, g, b] = wavelengthToDisplayRgb(450);
    expect(b).toBeCloseTo(1, 9);
    expect(r).toBeLessThan(0.8);
    expect(g).toBeLessThan(0.8);
  });

  it('wavelengthToDisplayRgb(630) is reddish and wavelengthToDisplayRgb(520) greenish', () => {
    const red = wavelengthToDisplayRgb(630);
    const green = wavelengthToDisplayRgb(520);
    expect(red[0]).toBeCloseTo(Math.max(...red), 9);
    expect(green[1]).toBeCloseTo(Math.max(...green), 9);
  });

  it('wavelengthToCss(800) is the near-infrared grey and isNearInfrared marks 700 nm and beyond', () => {
    expect(isNearInfrared(800)).toBe(true);
    expect(isNearInfrared(650)).toBe(false);
    expect(wavelengthToCss(800)).toBe('#4a4a4a');
    expect(wavelengthToCss(605)).toMatch(/^#[0-9a-f]{6}$/);
    expect(wavelengthToCss(605)).not.toBe(wavelengthToCss(525));
  });
});
