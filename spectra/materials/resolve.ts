import { intrinsicExtinction, type AbsorptionModel } from '../absorption';
import { SpectraError } from '../errors';
import { fwhmEvForFwhmNm } from '../lineshape';
import { evToNm } from '../units';
import { carbonEmissionPeakNm, CARBON_EXCITATION_MODEL } from './carbon';
import { optionalNumber } from './inputs';
import { CARBON_ABSORPTION, CUSTOM_NOMINAL_EXTINCTION, FIRST_EXCITON_SHARE, INTRINSIC_350NM_PER_CM } from './intrinsic';
import { SIZE_LAWS } from './laws';
import type { SizedMaterialId } from './params';
import { RECORDS } from './records';
import { diameterForEmissionPeakNm, sizedDotPeaks } from './sizing';
import { CARBON_EMISSION_RANGE_NM } from './table';
import { emissionFwhmEv } from './width';

/** The model's answer for one probe before spectra are sampled (dot.ts turns it into a ResolvedDot). */
export interface ModelPart {
  diameterNm: number | null;
  firstExcitonNm: number | null;
  /** The model's emission peak, nm (null for custom probes, which only have measured data). */
  peakNm: number | null;
  /** Emission FWHM in energy, eV (null for custom probes). */
  fwhmEv: number | null;
  model: string;
  typicalQuantumYield: number;
  warnings: string[];
  /** The modelled absorption (replaced by a measured extinction when one is given). */
  absorption: AbsorptionModel;
  absorptionWarning: string | null;
}

type Raw = Record<string, unknown>;

/** Sized materials: exactly one of diameterNm / emissionPeakNm (or neither with a measured emission). */
export function resolveSized(material: SizedMaterialId, raw: Raw, measuredPeakNm: number | undefined): ModelPart {
  const rec = RECORDS[material];
  const law = SIZE_LAWS[material];
  const hasD = raw.diameterNm !== undefined;
  const hasPeak = raw.emissionPeakNm !== undefined;
  if (hasD === hasPeak && !(measuredPeakNm !== undefined && !hasD)) {
    throw new SpectraError(
      'invalid_input',
      `give exactly one of diameterNm or emissionPeakNm for ${material}${hasD ? ', not both' : ''}`,
      ['diameterNm'],
    );
  }
  const pct = optionalNumber(raw, 'sizeDispersionPct', 0, 30, ' %') ?? rec.typicalSizeDispersionPct!;
  const fwhmNmIn = optionalNumber(raw, 'fwhmNm', 0, 500, ' nm', { minExclusive: true });
  const diameterNm = hasD
    ? (raw.diameterNm as number)
    : hasPeak
      ? diameterForEmissionPeakNm(material, raw.emissionPeakNm as number)
      : diameterForEmissionPeakNm(material, measuredPeakNm!, ['measuredEmission']);
  const { firstExcitonEv: e1, emissionPeakNm: peakNm } = sizedDotPeaks(material, diameterNm); // validates diameterNm
  const fwhmEv = fwhmNmIn !== undefined ? fwhmEvForFwhmNm(peakNm, fwhmNmIn) : emissionFwhmEv(material, diameterNm, pct);
  const warnings: string[] = [];
  if (fwhmNmIn !== undefined && raw.sizeDispersionPct !== undefined)
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
        ? `No published extinction law for ${material}: a nominal volume-scaled model is used (from memory, unverified); supply a measured extinction where brightness matters.`
        : null,
  };
}

/** Carbon dots: emission peak required (or measured), optional fwhmNm, modelled excitation dependence. */
export function resolveCarbon(
  raw: Raw,
  excitationNm: number | undefined,
  measuredPeakNm: number | undefined,
): ModelPart {
  if (raw.diameterNm !== undefined)
    throw new SpectraError('invalid_input', 'carbon dots have no size law: give emissionPeakNm, not diameterNm', [
      'diameterNm',
    ]);
  const rec = RECORDS.carbon;
  const [lo, hi] = CARBON_EMISSION_RANGE_NM;
  const given = optionalNumber(raw, 'emissionPeakNm', 0, 10000, ' nm', { minExclusive: true });
  if (given === undefined && measuredPeakNm === undefined)
    throw new SpectraError('invalid_input', 'carbon dots need emissionPeakNm', ['emissionPeakNm']);
  if (given !== undefined && (given < lo || given > hi)) {
    throw new SpectraError(
      'out_of_range',
      `an emission peak of ${given} nm is out of reach for carbon dots: accepted ${lo}–${hi} nm`,
      ['emissionPeakNm'],
    );
  }
  const fwhmNm = optionalNumber(raw, 'fwhmNm', 0, 500, ' nm', { minExclusive: true }) ?? rec.typicalFwhmNm;
  const warnings = [
    'Carbon-dot emission usually depends on the excitation wavelength; the emission peak is taken as the peak under near-UV excitation.',
  ];
  if (raw.sizeDispersionPct !== undefined) warnings.push('sizeDispersionPct is ignored for carbon dots (no size law).');
  let peakNm = given ?? measuredPeakNm!;
  if (excitationNm !== undefined && given !== undefined) {
    peakNm = carbonEmissionPeakNm(given, excitationNm);
    if (peakNm !== given)
      warnings.push(
        `Excited at ${excitationNm} nm the emission peak is modelled at ${peakNm.toFixed(1)} nm (shift of ${CARBON_EXCITATION_MODEL.slope} nm per nm beyond ${CARBON_EXCITATION_MODEL.referenceNm} nm; approximate).`,
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
      'Carbon-dot extinction is a nominal exponential tail (from memory, unverified); supply a measured extinction where brightness matters.',
  };
}

/** Custom probes: measured emission required; nominal flat absorption unless a measured extinction is given. */
export function resolveCustom(raw: Raw, measured: { peakNm: number } | null): ModelPart {
  if (!measured)
    throw new SpectraError('invalid_input', 'custom probes need measuredEmission (points of [nm, value])', [
      'measuredEmission',
    ]);
  if (raw.diameterNm !== undefined)
    throw new SpectraError('invalid_input', 'custom probes have no size law: remove diameterNm', ['diameterNm']);
  const warnings: string[] = [];
  if (raw.emissionPeakNm !== undefined)
    warnings.push('emissionPeakNm is ignored for custom probes: the peak is read from the measured emission.');
  if (raw.quantumYield === undefined)
    warnings.push(`quantumYield not given: a placeholder of ${RECORDS.custom.typicalQuantumYield} is assumed.`);
  return {
    diameterNm: null,
    firstExcitonNm: null,
    peakNm: null,
    fwhmEv: null,
    model: 'measured',
    typicalQuantumYield: RECORDS.custom.typicalQuantumYield,
    warnings,
    // A custom probe's emission peak is the measured one.
    absorption: { type: 'flat', epsilon: CUSTOM_NOMINAL_EXTINCTION, untilNm: measured.peakNm },
    absorptionWarning: `No measured extinction: a flat nominal ${CUSTOM_NOMINAL_EXTINCTION.toExponential(0)} M⁻¹ cm⁻¹ below the emission peak is assumed.`,
  };
}
