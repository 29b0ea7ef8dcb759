import { describe, expect, it } from 'vitest';
import { csvCell, orderingSheetCsv } from '../../web/io/csv-export';
import { describeFilter } from '../../web/io/filter-text';

/** A small RFC 4180 reader, enough to check the sheet parses back into the same cells. */
function parseCsv(text: string): string[][] {
  const rows: string[][] = [];
  let row: string[] = [];
  let cell = '';
  let quoted = false;
  for (let i = 0; i < text.length; i++) {
    const ch = text[i];
    if (quoted && ch === '"' && text[i + 1] === '"') {
      cell += '"';
      i++;
    } else if (ch === '"') {
      quoted = !quoted;
    } else if (quoted) {
      cell += ch;
    } else if (ch === ',') {
      row.push(cell);
      cell = '';
    } else if (ch === '\r' && text[i + 1] === '\n') {
      row.push(cell);
      rows.push(row);
      row = [];
      cell = '';
      i++;
    } else {
      cell += ch;
    }
  }
  return rows;
}

describe('ordering sheet CSV', () => {
  it('csvCell(text) prefixes a quote to cells starting with =, +, -, @ so spreadsheets do not run them', () => {
    expect(csvCell('=HYPERLINK("x")')).toBe(`"'=HYPERLINK(""x"")"`);
    expect(csvCell('+1')).toBe("'+1");
    expect(csvCell('-2+3')).toBe("'-2+3");
    expect(csvCell('@SUM(A1)')).toBe("'@SUM(A1)");
    expect(csvCell('plain text')).toBe('plain text');
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
    expect(probeRow.slice(1, 7)).toEqual(['Dot, red', "'@nuclear envelope", 'cdse', '5.12', '605', '28']);
    const channelRow = rows.find((r) => r[0] === 'c1')!;
    expect(channelRow[2]).toBe('bandpass 605/20');
    expect(channelRow[3]).toBe('405 nm');
  });
});
