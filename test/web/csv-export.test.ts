import { describe, expect, it } from 'vitest';
import { csvCell, hazardText, orderingSheetCsv } from '../../web/io/csv-export';
import { describeFilter } from '../../web/io/filter-text';
import { parseCsv } from './helpers/parse-csv';

describe('ordering sheet CSV', () => {
  it('csvCell(text) prefixes a quote to cells starting with =, +, -, @ so spreadsheets do not run them', () => {
    expect(csvCell('=HYPERLINK("x")')).toBe(`"'=HYPERLINK(""x"")"`);
    expect(csvCell('+1')).toBe("'+1");
    expect(csvCell('-2+3')).toBe("'-2+3");
    expect(csvCell('@SUM(A1)')).toBe("'@SUM(A1)");
    expect(csvCell('plain text')).toBe('plain text');
  });

  it('csvCell prefixes a quote to text whose first character after leading spaces is =, +, -, @, tab or CR', () => {
    expect(csvCell('  =1+1')).toBe("'  =1+1");
    expect(csvCell(' @x')).toBe("' @x");
    expect(csvCell('\tcmd')).toBe("'\tcmd");
    expect(csvCell('\rcmd')).toBe(`"'\rcmd"`);
    expect(csvCell('  plain')).toBe('  plain');
  });

  it('csvCell also prefixes a quote after leading no-break spaces or a newline before the formula character', () => {
    expect(csvCell('\u00a0=1+1')).toBe("'\u00a0=1+1");
    expect(csvCell('\n=HYPERLINK(1)')).toBe(`"'\n=HYPERLINK(1)"`);
    expect(csvCell('\u00a0plain')).toBe('\u00a0plain');
  });

  it('csvCell writes a negative number as a number, without the quote it gives text starting with a minus', () => {
    expect(csvCell(-0.25)).toBe('-0.25');
    expect(csvCell('-0.25')).toBe("'-0.25");
  });

  it('csvCell quotes commas, quotes and line breaks (RFC 4180) and leaves non-finite numbers empty', () => {
    expect(csvCell('a,b')).toBe('"a,b"');
    expect(csvCell('line\nbreak')).toBe('"line\nbreak"');
    expect(csvCell(Number.NaN)).toBe('');
    expect(csvCell(605)).toBe('605');
  });

  it('describeFilter names bandpass as centre/width and edges by their wavelength', () => {
    expect(describeFilter({ type: 'bandpass', centerNm: 605, widthNm: 20 })).toBe('bandpass 605/20');
    expect(describeFilter({ type: 'longpass', edgeNm: 650 })).toBe('longpass 650');
    expect(describeFilter({ type: 'shortpass', edgeNm: 550.25 })).toBe('shortpass 550.3');
  });

  it("orderingSheetCsv writes each probe's resolved size, each channel's filters, and escapes formula text", () => {
    const csv = orderingSheetCsv(
      {
        version: 1,
        title: '=cmd|calc',
        excitation: [{ wavelengthNm: 405 }],
        probes: [{ id: 'p1', label: 'Dot, red', material: 'cdse', emissionPeakNm: 605, target: '@nuclear envelope' }],
        channels: [{ id: 'c1', filters: [{ type: 'bandpass', centerNm: 605, widthNm: 20 }], excitationNm: 405 }],
      },
      [{ diameterNm: 5.123, emissionPeakNm: 605, fwhmNm: 28.04, firstExcitonNm: 590 }],
    );
    const rows = parseCsv(csv);
    expect(rows[0]).toEqual(['panel', "'=cmd|calc"]);
    const probeRow = rows.find((r) => r[0] === 'p1')!;
    expect(probeRow.slice(1, 8)).toEqual(['Dot, red', "'@nuclear envelope", 'cdse', '', '5.12', '605', '28']);
    const channelRow = rows.find((r) => r[0] === 'c1')!;
    expect(channelRow[2]).toBe('bandpass 605/20');
    expect(channelRow[3]).toBe('405 nm');
  });

  it('orderingSheetCsv writes shell, target / conjugate, hazard; leaves supplier, catalogue, amount blank', () => {
    const csv = orderingSheetCsv(
      {
        version: 1,
        excitation: [{ wavelengthNm: 405 }],
        probes: [
          {
            id: 'p1',
            material: 'inp',
            emissionPeakNm: 620,
            target: 'anti-CD3 IgG',
            shell: [
              { material: 'znse', thicknessNm: 0.5 },
              { material: 'zns', thicknessNm: 1.25 },
            ],
          },
          { id: 'p2', material: 'inp', emissionPeakNm: 560, shell: [{ material: 'cds', thicknessNm: 0.4 }] },
        ],
        channels: [{ id: 'c1', filters: [{ type: 'bandpass', centerNm: 620, widthNm: 20 }] }],
      },
      [],
    );
    const rows = parseCsv(csv);
    const header = rows.find((r) => r[0] === 'probe')!;
    const cell = (r: string[], name: string) => r[header.indexOf(name)];
    const [p1, p2] = ['p1', 'p2'].map((id) => rows.find((r) => r[0] === id)!);
    expect(cell(p1, 'target / conjugate')).toBe('anti-CD3 IgG');
    expect(cell(p1, 'shell')).toBe('ZnSe 0.5 nm; ZnS 1.25 nm');
    for (const name of ['supplier', 'catalogue number', 'amount'])
      expect([cell(p1, name), cell(p2, name)]).toEqual(['', '']);
    // InP in ZnSe/ZnS has no cadmium, lead or arsenic; a CdS shell brings cadmium into the same InP core.
    expect(cell(p1, 'hazard')).toMatch(
      /^material hazard level moderate; see its hazard notes.*; handle per local rules/,
    );
    expect(cell(p2, 'hazard')).toBe(
      'contains cadmium; material hazard level moderate; handle per local rules and your institution',
    );
  });

  it('hazardText names regulated classes and the core material hazard level, always deferring to local rules', () => {
    expect(hazardText({ material: 'gaas', shell: [{ material: 'cds', thicknessNm: 1 }] })).toMatch(
      /^contains cadmium and arsenic; material hazard level high; handle per local rules/,
    );
    for (const material of ['carbon', 'dye', 'cdse', 'cspbbr3'] as const) {
      const text = hazardText({ material });
      expect(text).toContain('handle per local rules');
      expect(text).not.toMatch(/\bsafe\b/i);
    }
  });
});
