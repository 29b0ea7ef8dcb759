import { intrinsicExtinction, type AbsorptionModel } from './absorption';
import { SpectraError } from '../core/errors';
import { fwhmEvForFwhmNm } from './lineshape';
import { evToNm } from '../core/units';
import type { DotInput } from '../core/panel';
import { CARBON_EMISSION_RANGE_NM, CARBON_EXCITATION_MODEL, carbonEmissionPeakNm } from './sizing/carbon';
import {
  CARBON_ABSORPTION,
  CUSTOM_ABSORPTION,
  FIRST_EXCITON_SHARE,
  INTRINSIC_350NM_PER_CM,
} from './materials/intrinsic';
import { getDye } from './dyes/catalog';
import {
  NOMINAL_ABSORPTION_ASYMMETRY,
  logNormalBandForNm,
  logNormalEmissionBand,
  nmToPerCm,
  type LogNormalBand,
} from './lognormal';
import { SIZE_LAWS } from './sizing/laws';
import type { SizedMaterialId } from './materials/params';
import { RECORDS } from './materials/records';
import { diameterForEmissionPeakNm, sizedDotPeaks } from './sizing/sizing';
import { emissionFwhmEv } from './sizing/width';

/** The model's answer for one probe before spectra are sampled (resolve.ts turns it into a ResolvedDot). */
export interface ModelPart {
  diameterNm: number | null;
  firstExcitonNm: number | null;
  /** The model's emission peak, nm (null for custom probes, which only have measured data). */
  peakNm: number | null;
  /** Emission FWHM in energy, eV, of the Gaussian line (null for custom probes and dyes). */
  fwhmEv: number | null;
  /** A dye's log-normal emission band and its per-nm FWHM, nm (in place of the Gaussian line). */
  emissionBand?: { band: LogNormalBand; fwhmNm: number };
  model: string;
  typicalQuantumYield: number;
  warnings: string[];
  /** The modelled absorption (replaced by a measured extinction when one is given). */
  absorption: AbsorptionModel;
  absorptionWarning: string | null;
}

/**
 * Sized materials: the size from diameterNm, else from emissionPeakNm, else from the measured emission's peak (the
 * API's schema asks for exactly one of the first two).
 */
export function resolveSized(material: SizedMaterialId, dot: DotInput, measuredPeakNm: number | undefined): ModelPart {
  const rec = RECORDS[material];
  const law = SIZE_LAWS[material];
  const pct = dot.sizeDispersionPct ?? rec.typicalSizeDispersionPct!;
  const fwhmNmIn = dot.fwhmNm;
  let diameterNm: number;
  if (dot.diameterNm !== undefined) diameterNm = dot.diameterNm;
  else if (dot.emissionPeakNm !== undefined) diameterNm = diameterForEmissionPeakNm(material, dot.emissionPeakNm);
  else if (measuredPeakNm !== undefined)
    diameterNm = diameterForEmissionPeakNm(material, measuredPeakNm, ['measuredEmission']);
  else throw new SpectraError('invalid_input', `${material} needs diameterNm or emissionPeakNm`, ['emissionPeakNm']);
  const { firstExcitonEv: e1, emissionPeakNm: peakNm } = sizedDotPeaks(material, diameterNm); // the law's range
  const fwhmEv = fwhmNmIn !== undefined ? fwhmEvForFwhmNm(peakNm, fwhmNmIn) : emissionFwhmEv(material, diameterNm, pct);
  const warnings: string[] = [];
  if (fwhmNmIn !== undefined && dot.sizeDispersionPct !== undefined)
    warnings.push('fwhmNm was given, so sizeDispersionPct does not set the width.');
  if (material === 'cspbbr3' && diameterNm > 10)
    warnings.push('Weak confinement above ~10 nm edge: the emission peak barely depends on size here.');
  const eps350 = intrinsicExtinction(law.particleVolumeNm3(diameterNm), INTRINSIC_350NM_PER_CM[material]);
  const published = law.publishedExtinction(diameterNm);
  return {
    diameterNm,
    firstExcitonNm: evToNm(e1),
    peakNm,
    fwhmEv,
    model: law.model,
    typicalQuantumYield: rec.typicalQuantumYield,
    warnings,
    absorption: {
      type: 'exciton',
      firstExcitonEv: e1,
      firstExcitonEpsilon: published ?? FIRST_EXCITON_SHARE * eps350,
      lineFwhmEv: fwhmEv,
      epsilonAt350: eps350,
    },
    absorptionWarning:
      published === null
        ? `No published extinction law for ${material}: a nominal volume-scaled model is used (from memory, ` +
          `unverified); supply a measured extinction where brightness matters.`
        : null,
  };
}

/** Carbon dots: emission peak required (or measured), optional fwhmNm, modelled excitation dependence. */
export function resolveCarbon(dot: DotInput, measuredPeakNm: number | undefined): ModelPart {
  const rec = RECORDS.carbon;
  const [lo, hi] = CARBON_EMISSION_RANGE_NM;
  const given = dot.emissionPeakNm;
  const excitationNm = dot.excitationNm;
  if (given === undefined && measuredPeakNm === undefined)
    throw new SpectraError('invalid_input', 'carbon dots need emissionPeakNm', ['emissionPeakNm']);
  if (given !== undefined && !(given >= lo && given <= hi)) {
    throw new SpectraError(
      'out_of_range',
      `an emission peak of ${given} nm is out of reach for carbon dots: accepted ${lo}–${hi} nm`,
      ['emissionPeakNm'],
    );
  }
  const fwhmNm = dot.fwhmNm ?? rec.typicalFwhmNm;
  const warnings = [
    'Carbon-dot emission usually depends on the excitation wavelength; the emission peak is taken as the peak under ' +
      'near-UV excitation.',
  ];
  if (dot.sizeDispersionPct !== undefined) warnings.push('sizeDispersionPct is ignored for carbon dots (no size law).');
  let peakNm = given ?? measuredPeakNm!;
  if (excitationNm !== undefined && given !== undefined) {
    peakNm = carbonEmissionPeakNm(given, excitationNm);
    if (peakNm !== given)
      warnings.push(
        `Excited at ${excitationNm} nm the emission peak is modelled at ${peakNm.toFixed(1)} nm (shift of ` +
          `${CARBON_EXCITATION_MODEL.slope} nm per nm beyond ${CARBON_EXCITATION_MODEL.referenceNm} nm; approximate).`,
      );
  }
  return {
    diameterNm: null,
    firstExcitonNm: null,
    peakNm,
    fwhmEv: fwhmEvForFwhmNm(peakNm, fwhmNm),
    model: 'carbon-dot nominal model (no size law; approximate excitation dependence)',
    typicalQuantumYield: rec.typicalQuantumYield,
    warnings,
    absorption: { type: 'tail', epsilonAt350: CARBON_ABSORPTION.epsilonAt350, decayNm: CARBON_ABSORPTION.decayNm },
    absorptionWarning:
      'Carbon-dot extinction is a nominal exponential tail (from memory, unverified); supply a measured extinction ' +
      'where brightness matters.',
  };
}

/**
 * Custom probes: measured emission required. Without a measured extinction the absorption is a log-normal band
 * (lognormal.ts) at absorptionPeakNm with peak ε extinctionPeak, as wide in energy as the measured emission (the
 * mirror-image rule, common practice; Lakowicz, Principles of Fluorescence Spectroscopy 2006, M); without those
 * fields, at the emission peak less a nominal Stokes shift and with a nominal ε (CUSTOM_ABSORPTION), with a warning.
 */
export function resolveCustom(
  dot: DotInput,
  measured: { peakNm: number; halfMaxNm: [number, number] } | null,
): ModelPart {
  if (!measured)
    throw new SpectraError('invalid_input', 'custom probes need measuredEmission (points of [nm, value])', [
      'measuredEmission',
    ]);
  const warnings: string[] = [];
  if (dot.emissionPeakNm !== undefined)
    warnings.push('emissionPeakNm is ignored for custom probes: the peak is read from the measured emission.');
  if (dot.quantumYield === undefined)
    warnings.push(`quantumYield not given: a placeholder of ${RECORDS.custom.typicalQuantumYield} is assumed.`);
  if (dot.extinction !== undefined && (dot.absorptionPeakNm !== undefined || dot.extinctionPeak !== undefined))
    warnings.push('absorptionPeakNm and extinctionPeak are not used: the measured extinction replaces the band.');
  const { stokesShiftPerCm, extinctionPeak: nominalEpsilon } = CUSTOM_ABSORPTION;
  const peakNm = dot.absorptionPeakNm ?? nmToPerCm(nmToPerCm(measured.peakNm) + stokesShiftPerCm);
  const peakEpsilon = dot.extinctionPeak ?? nominalEpsilon;
  const [blueNm, redNm] = measured.halfMaxNm;
  const band = {
    peakPerCm: nmToPerCm(peakNm),
    fwhmPerCm: nmToPerCm(blueNm) - nmToPerCm(redNm),
    asymmetry: NOMINAL_ABSORPTION_ASYMMETRY,
  };
  if (peakNm >= measured.peakNm)
    warnings.push(
      `The absorption band peaks at ${peakNm.toFixed(1)} nm, not below the emission peak ` +
        `(${measured.peakNm.toFixed(1)} nm); it is used as given.`,
    );
  const defaults = [
    dot.absorptionPeakNm === undefined
      ? `at ${peakNm.toFixed(1)} nm, the emission peak less a nominal Stokes shift of ${stokesShiftPerCm} cm⁻¹`
      : null,
    dot.extinctionPeak === undefined ? `with a nominal peak ε of ${nominalEpsilon.toExponential(0)} M⁻¹ cm⁻¹` : null,
  ].filter((x) => x !== null);
  return {
    diameterNm: null,
    firstExcitonNm: null,
    peakNm: null,
    fwhmEv: null,
    model: 'measured',
    typicalQuantumYield: RECORDS.custom.typicalQuantumYield,
    warnings,
    absorption: { type: 'lognormal', band, peakEpsilon },
    absorptionWarning:
      defaults.length === 0
        ? null
        : `No measured extinction: a log-normal absorption band as wide as the emission is modelled ` +
          `${defaults.join(' and ')} (from memory, unverified); give absorptionPeakNm and extinctionPeak, or a ` +
          'measured extinction, where brightness matters.',
  };
}

/**
 * Dyes, counterstains and fluorescent proteins of the dye library: log-normal emission and absorption bands from the
 * dye's record; fwhmNm and quantumYield on the probe override the record (a measured emission or extinction replaces
 * the bands in resolveDot).
 */
export function resolveDye(dot: DotInput): ModelPart {
  if (dot.dye === undefined)
    throw new SpectraError('invalid_input', 'dye probes need dye, the id of a dye of the library (GET /api/v1/dyes)', [
      'dye',
    ]);
  const dye = getDye(dot.dye);
  const peakNm = dye.emissionPeakNm.value;
  const fwhmNm = dot.fwhmNm ?? dye.emissionFwhmNm.value;
  const band = logNormalEmissionBand(peakNm, fwhmNm, dye.emissionAsymmetry.value);
  if (band === null)
    throw new SpectraError(
      'out_of_range',
      `an emission FWHM of ${fwhmNm} nm is out of reach for a band peaked at ${peakNm} nm`,
      ['fwhmNm'],
    );
  const warnings = [`${dye.name}: values for ${dye.conditions}; other conditions move peaks, ε and quantum yield.`];
  const ignored = (['emissionPeakNm', 'diameterNm', 'sizeDispersionPct'] as const).filter((f) => dot[f] !== undefined);
  if (ignored.length > 0) warnings.push(`${ignored.join(', ')} ignored for dyes: the dye's record sets the bands.`);
  const numbers = [dye.absorptionPeakNm, dye.emissionPeakNm, dye.extinctionPeak, dye.quantumYield];
  if (numbers.some((n) => n.status === 'M'))
    warnings.push('Some of its numbers are from memory, unverified: GET /api/v1/dyes gives each source and status.');
  const absorption = logNormalBandForNm(
    dye.absorptionPeakNm.value,
    dye.absorptionFwhmNm.value,
    dye.absorptionAsymmetry.value,
  );
  return {
    diameterNm: null,
    firstExcitonNm: null,
    peakNm,
    fwhmEv: null,
    emissionBand: { band, fwhmNm },
    model: `dye library: ${dye.id} (log-normal bands, Siano & Metzler 1969)`,
    typicalQuantumYield: dye.quantumYield.value,
    warnings,
    absorption: { type: 'lognormal', band: absorption, peakEpsilon: dye.extinctionPeak.value },
    absorptionWarning:
      'The absorption is one log-normal band: bands further in the UV, which most dyes have, are not modelled.',
  };
}
