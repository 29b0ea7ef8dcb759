import { describe, expect, it } from 'vitest';
import { errorOf } from './helpers/errors';
import { DEFAULT_GRID, channelTransmission, parseSpectrumCsv } from '../../spectra/index';

// A made-up measured bandpass around 600 nm, in 0–1 and in percent.
const rows = [
  [550, 0.0001],
  [580, 0.002],
  [590, 0.45],
  [600, 0.92],
  [610, 0.5],
  [620, 0.003],
  [650, 0.0001],
];

describe('parseSpectrumCsv', () => {
  it('parseSpectrumCsv gives the same channel from a filter table in percent (header or values) and in 0–1', () => {
    const fraction = rows.map(([nm, t]) => `${nm},${t}`).join('\n');
    const percentByHeader = 'wavelength (nm);T (%)\n' + rows.map(([nm, t]) => `${nm};${t * 100}`).join('\n');
    const percentByValue = rows.map(([nm, t]) => `${nm}\t${t * 100}`).join('\r\n');
    const channel = (text: string) =>
      channelTransmission(
        { id: 'c', filters: [{ type: 'table', points: parseSpectrumCsv(text).points }] },
        DEFAULT_GRID,
      );
    const a = channel(fraction);
    expect(parseSpectrumCsv(fraction).warnings).toEqual([]);
    expect(parseSpectrumCsv(percentByHeader).warnings[0]).toMatch(/percent/);
    for (const other of [channel(percentByHeader), channel(percentByValue)]) {
      for (let i = 0; i < a.length; i++) expect(other[i]).toBeCloseTo(a[i], 14);
    }
    expect(a[600 - DEFAULT_GRID.startNm]).toBeCloseTo(0.92, 14);
  });

  it('parseSpectrumCsv detects percent from the header alone even when every value is at most 1.5', () => {
    const { points } = parseSpectrumCsv('nm, %T\n500, 0.5\n600, 1.2');
    expect(points).toEqual([
      [500, 0.005],
      [600, 0.012],
    ]);
  });

  it('parseSpectrumCsv skips comments and blank lines and clips small transmission excursions with a warning', () => {
    const out = parseSpectrumCsv('# measured 2026\n\n500 -0.001\n600 1.01\n700 0.5\n');
    expect(out.points).toEqual([
      [500, 0],
      [600, 1],
      [700, 0.5],
    ]);
    expect(out.warnings.join(' ')).toMatch(/2 transmission values outside 0–1 were clipped/);
  });

  it('parseSpectrumCsv(kind emission) sets negative baseline values to 0 and never reads percent', () => {
    const out = parseSpectrumCsv('500,-3\n600,250\n700,10', { kind: 'emission' });
    expect(out.points).toEqual([
      [500, 0],
      [600, 250],
      [700, 10],
    ]);
    expect(out.warnings).toHaveLength(1);
  });

  it('parseSpectrumCsv resamples over 1,000 rows to 1,000 evenly spaced points, exactly for a linear table', () => {
    const text = Array.from({ length: 2001 }, (_, i) => `${400 + i * 0.2},${0.1 + i * 0.0004}`).join('\n');
    const out = parseSpectrumCsv(text);
    expect(out.points).toHaveLength(1000);
    expect(out.points[0][0]).toBe(400);
    expect(out.points[999][0]).toBeCloseTo(800, 9);
    for (const [nm, t] of out.points) expect(t).toBeCloseTo(0.1 + (nm - 400) * 0.002, 12);
    expect(out.warnings.join(' ')).toMatch(/resampled from 2001 to 1000/);
  });

  it('parseSpectrumCsv rejects an empty table, a ragged row, a row out of order, a bad number, naming the line', () => {
    expect(errorOf(() => parseSpectrumCsv('')).code).toBe('invalid_table');
    expect(errorOf(() => parseSpectrumCsv('nm,T\n500,0.5')).message).toMatch(/at least 2 data rows/);
    const ragged = errorOf(() => parseSpectrumCsv('nm,T\n500,0.5\n510,0.6,7\n520,0.7'));
    expect(ragged.path).toEqual(['line', 3]);
    expect(ragged.message).toMatch(/line 3: expected 2 columns/);
    const order = errorOf(() => parseSpectrumCsv('500,0.5\n520,0.6\n510,0.7'));
    expect(order.path).toEqual(['line', 3]);
    expect(order.message).toMatch(/out of order/);
    expect(errorOf(() => parseSpectrumCsv('500,0.5\n510,0.6\n520,0.7\n530,abc')).path).toEqual(['line', 4]);
    expect(errorOf(() => parseSpectrumCsv('500,0.5\n510,1'.repeat(300))).path).toEqual(['line', 2]);
    expect(errorOf(() => parseSpectrumCsv('500,5e4\n510,-1', { kind: 'extinction' })).path).toEqual(['line', 2]);
  });
});
