/**
 * Sample autofluorescence. The default spectrum is a sum of broad emission bands of the usual endogenous
 * fluorophores, each weighted by how strongly the excitation line excites it:
 *   collagen/elastin (emission ~400 nm, UV-excited), NAD(P)H (~460 nm, UV/violet), flavins (~530 nm, blue and
 *   near-UV), lipofuscin (broad, ~590 nm, excited from UV to green), porphyrins (~635 and ~700 nm, Soret band ~405 nm).
 * Band positions are the commonly quoted ones (common practice); every width, excitation band and relative brightness
 * below is FROM MEMORY, unverified and approximate: real tissue varies by type, fixation and age by orders of
 * magnitude. A sample type's preset (background-presets.ts) replaces the default bands; a measured background
 * spectrum replaces the model.
 */
import type { BackgroundSpec } from '../core/panel';
import { sampleTable, type WavelengthGrid } from '../core/grid';
import { bandsEmission, type AutofluorescenceBand } from './bands';
import { presetAutofluorescence } from './background-presets';

// The Soret band and two Q bands, which excite both porphyrin emission bands (from memory).
const PORPHYRIN_EXCITATION: AutofluorescenceBand['excitation'] = [
  [405, 30, 1],
  [505, 30, 0.1],
  [630, 20, 0.05],
];

/** The default autofluorescence bands (approximate, from memory; see the file header). */
export const AUTOFLUORESCENCE_BANDS: readonly AutofluorescenceBand[] = Object.freeze([
  { name: 'collagen/elastin', emissionNm: 400, emissionFwhmNm: 80, excitation: [[330, 50, 1]], brightness: 0.8 },
  { name: 'NAD(P)H', emissionNm: 460, emissionFwhmNm: 110, excitation: [[340, 60, 1]], brightness: 1 },
  {
    name: 'flavins',
    emissionNm: 530,
    emissionFwhmNm: 100,
    excitation: [
      [450, 70, 1],
      [370, 50, 0.7],
    ],
    brightness: 0.6,
  },
  { name: 'lipofuscin', emissionNm: 590, emissionFwhmNm: 180, excitation: [[360, 250, 1]], brightness: 0.5 },
  {
    name: 'porphyrins',
    emissionNm: 635,
    emissionFwhmNm: 30,
    excitation: PORPHYRIN_EXCITATION,
    brightness: 0.15,
  },
  {
    name: 'porphyrins (second band)',
    emissionNm: 700,
    emissionFwhmNm: 30,
    excitation: PORPHYRIN_EXCITATION,
    brightness: 0.05,
  },
]);

/**
 * Scale of `level`: level 1 means the sample's autofluorescence emits as many photons as one probe with
 * extinction × quantum yield = 1e5 M⁻¹ cm⁻¹ at abundance 1 under the same line (for the default model and for
 * fresh-frozen tissue's preset, under a 405 nm line). A convention of this tool, chosen so that background and probe
 * signals share one unit; not a measured value.
 */
export const BACKGROUND_REFERENCE_BRIGHTNESS = 1e5;

/**
 * Default autofluorescence emission (relative photon density per nm) under a line at `excitationNm`: the bands above,
 * each a Gaussian in wavelength with unit area times brightness × excitation weight. Total area is about 1 for a
 * violet line, less towards the red (about 0.006 at 640 nm): red lines excite tissue far less (common practice).
 */
export function defaultAutofluorescence(excitationNm: number, grid: WavelengthGrid): number[] {
  return bandsEmission(AUTOFLUORESCENCE_BANDS, excitationNm, grid);
}

/**
 * Background emission on the grid in the panel's signal units, per unit line power: level × 1e5 × the default
 * spectrum for that line, or × the preset's spectrum for that line (on the presets' shared scale, see
 * background-presets.ts), or × a measured spectrum normalised to unit area on the grid (a measured spectrum is taken
 * as it is for every line, its excitation dependence being unknown).
 */
export function backgroundEmission(spec: BackgroundSpec, excitationNm: number, grid: WavelengthGrid): number[] {
  const scale = spec.level * BACKGROUND_REFERENCE_BRIGHTNESS;
  const out =
    spec.points !== undefined
      ? sampleTable(spec.points, grid)
      : spec.preset !== undefined
        ? presetAutofluorescence(spec.preset, excitationNm, grid)
        : defaultAutofluorescence(excitationNm, grid);
  let area = 1;
  if (spec.points !== undefined) {
    area = 0;
    for (let i = 0; i < out.length; i++) area += out[i] * grid.stepNm;
    if (!(area > 0)) return out;
  }
  for (let i = 0; i < out.length; i++) out[i] *= scale / area;
  return out;
}
