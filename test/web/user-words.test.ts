// Refusals in the user's words: the row by its label, the field as a microscopist says it, the value typed.
import { describe, expect, it } from 'vitest';
import type { PanelSpec } from '../../spectra/index';
import { inUserWords } from '../../web/state/user-words';

const panel: PanelSpec = {
  version: 1,
  excitation: [{ wavelengthNm: 50 }],
  probes: [{ id: 'p1', material: 'cdse', emissionPeakNm: 990, quantumYield: 3 }],
  channels: [{ id: 'c1', label: 'Far red', filters: [{ type: 'bandpass', centerNm: 5000, widthNm: 20 }] }],
};

describe('inUserWords', () => {
  it("a range refusal names the channel by its label, the centre typed and the range: 'Channel 'Far red': …'", () => {
    const message = 'channels[0].filters[0].centerNm must be between 200 and 2000 nm';
    const path = ['channels', 0, 'filters', 0, 'centerNm'];
    expect(inUserWords({ code: 'out_of_range', message, path }, panel)).toBe(
      "Channel 'Far red': a centre of 5000 nm is outside 200–2000 nm",
    );
  });

  it('a custom probe with no spectrum is told, by its label, that it needs its measured emission loaded', () => {
    const custom: PanelSpec = { ...panel, probes: [{ id: 'p1', label: 'Lab dot', material: 'custom' }] };
    const message = "probes[0].measuredEmission is required for material 'custom'";
    expect(inUserWords({ code: 'invalid_input', message, path: ['probes', 0, 'measuredEmission'] }, custom)).toBe(
      "Probe 'Lab dot' needs data: load its measured emission spectrum (a CSV of wavelength in nm and intensity) in " +
        'its row, or choose a material the model knows',
    );
  });

  it('a probe without a label is named by its id; a unitless range keeps no unit', () => {
    const message = 'probes[0].quantumYield must be between 0 and 1';
    expect(inUserWords({ code: 'out_of_range', message, path: ['probes', 0, 'quantumYield'] }, panel)).toBe(
      "Probe 'p1': a quantum yield of 3 is outside 0–1",
    );
  });

  it("a model's sentence is kept after the row's name; a path outside the rows keeps the message", () => {
    const sentence = 'an emission peak of 990 nm is out of reach of cdse (480–680 nm)';
    expect(inUserWords({ code: 'out_of_range', message: sentence, path: ['probes', 0, 'emissionPeakNm'] }, panel)).toBe(
      `Probe 'p1': ${sentence}`,
    );
    const title = 'title must be at most 200 characters';
    expect(inUserWords({ code: 'invalid_input', message: title, path: ['title'] }, panel)).toBe(title);
  });
});
