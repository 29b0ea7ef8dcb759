import { intrinsicExtinction, type AbsorptionModel } from './absorption';
import { SpectraError } from '../core/errors';
import { fwhmEvForFwhmNm } from './lineshape';
import { evToNm, nmToEv } from '../core/units';
import type { DotInput, ShellLayer } from '../core/panel';
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
import { CDSE_JASIENIAK_2009, SIZE_LAWS, sizeLawFor } from './sizing/laws';
import type { SizedMaterialId } from './materials/params';
import { RECORDS } from './materials/records';
import { diameterForEmissionPeakNm, sizedDotPeaks, type SizingOptions } from './sizing/sizing';
import { emissionFwhmEv } from './sizing/width';
import { carrierReach, shellAbsorptionParts, shellThicknessNm } from './shells/shell';
import { SHELL_MATERIALS } from './shells/materials';

/** The model's answer for one probe before spectra are sampled (resolve.ts turns it into a ResolvedDot). */
export interface ModelPart {
  diameterNm: number | null;
  /** Core plus every shell layer, nm (the core alone for a bare core; null without a size law). */
  overallDiameterNm: number | null;
  /** Typical hydrodynamic diameter of a water-soluble conjugate of this material, nm (nominal; null where unknown). */
  hydrodynamicDiameterNm: number | null;
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
  const law = sizeLawFor(material, dot.sizingModel);
  const shell = dot.shell ?? [];
  const sizing: SizingOptions = { shell, sizingModel: dot.sizingModel };
  const pct = dot.sizeDispersionPct ?? rec.typicalSizeDispersionPct!;
  const fwhmNmIn = dot.fwhmNm;
  let diameterNm: number;
  if (dot.diameterNm !== undefined) diameterNm = dot.diameterNm;
  else if (dot.emissionPeakNm !== undefined)
    diameterNm = diameterForEmissionPeakNm(material, dot.emissionPeakNm, ['emissionPeakNm'], sizing);
  else if (measuredPeakNm !== undefined)
    diameterNm = diameterForEmissionPeakNm(material, measuredPeakNm, ['measuredEmission'], sizing);
  else throw new SpectraError('invalid_input', `${material} needs diameterNm or emissionPeakNm`, ['emissionPeakNm']);
  const { firstExcitonEv: e1, emissionPeakNm: peakNm } = sizedDotPeaks(material, diameterNm, sizing); // law's range
  const fwhmEv =
    fwhmNmIn !== undefined ? fwhmEvForFwhmNm(peakNm, fwhmNmIn) : emissionFwhmEv(material, law, diameterNm, pct);
  const warnings: string[] = [];
  if (fwhmNmIn !== undefined && dot.sizeDispersionPct !== undefined)
    warnings.push('fwhmNm was given, so sizeDispersionPct does not set the width.');
  if (material === 'cspbbr3' && diameterNm > 10)
    warnings.push('Weak confinement above ~10 nm edge: the emission peak barely depends on size here.');
  if (law.illustrative)
    warnings.push(
      `Illustrative only: ${rec.name} has no published size law here (Brus equation alone); its peak, width and ` +
        'extinction are not credible enough to order by.',
    );
  warnings.push(...shellWarnings(material, diameterNm, shell));
  if (material === 'cdse')
    warnings.push(cdseCurveComparison(evToNm(e1), law === CDSE_JASIENIAK_2009, shell.length > 0));
  const eps350 = intrinsicExtinction(law.particleVolumeNm3(diameterNm), INTRINSIC_350NM_PER_CM[material]);
  const published = law.publishedExtinction(diameterNm);
  const overallDiameterNm = diameterNm + 2 * shellThicknessNm(shell);
  return {
    diameterNm,
    overallDiameterNm,
    // The typical conjugate's size holds for typical shells; a particle as large or larger has no nominal value.
    hydrodynamicDiameterNm:
      rec.typicalHydrodynamicDiameterNm !== null && overallDiameterNm < rec.typicalHydrodynamicDiameterNm
        ? rec.typicalHydrodynamicDiameterNm
        : null,
    firstExcitonNm: evToNm(e1),
    peakNm,
    fwhmEv,
    model: shell.length > 0 ? `${law.model}; core/shell shift and shell absorption (approximate)` : law.model,
    typicalQuantumYield: rec.typicalQuantumYield,
    warnings,
    absorption: {
      type: 'exciton',
      firstExcitonEv: e1,
      firstExcitonEpsilon: published ?? FIRST_EXCITON_SHARE * eps350,
      lineFwhmEv: fwhmEv,
      epsilonAt350: eps350,
      ...(shell.length > 0 ? { shells: shellAbsorptionParts(diameterNm, shell, law.particleVolumeNm3) } : {}),
    },
    absorptionWarning:
      published === null
        ? `No published extinction law for ${material}: a nominal volume-scaled model is used (from memory, ` +
          `unverified); supply a measured extinction where brightness matters.`
        : null,
  };
}

/** What a user should know about a shell: thin or unusual layers, carriers spreading into it, the approximation. */
function shellWarnings(material: SizedMaterialId, coreNm: number, shell: readonly ShellLayer[]): string[] {
  if (shell.length === 0) return [];
  const out = [
    "Core/shell: the shell's red shift and absorption are this tool's approximation (effective-mass leakage and " +
      'volume-scaled bulk absorption); the emission peak given is that of the core/shell dot.',
  ];
  shell.forEach((layer, i) => {
    const ml = layer.thicknessNm / SHELL_MATERIALS[layer.material].monolayerNm;
    if (layer.thicknessNm > 0 && ml < 1)
      out.push(`Shell layer ${i + 1} (${layer.material}) is thinner than one monolayer (${ml.toFixed(2)} ML).`);
  });
  if (carrierReach(material, shell).spreads)
    out.push(
      'A carrier has no barrier in this shell (quasi type II or type II): it spreads into the shell, the red shift ' +
        'is large and its model least certain; expect longer lifetimes and broader lines than a type-I shell gives.',
    );
  if (shell.some((l) => l.material === 'cds') && material !== 'cdse' && material !== 'cdte' && material !== 'cds')
    out.push('A CdS shell adds cadmium to a cadmium-free core.');
  if (coreNm + 2 * shellThicknessNm(shell) > 20)
    out.push('The particle is over 20 nm across before its coating: check that it still labels the target.');
  return out;
}

/**
 * How the two published CdSe curves disagree at this colour (first exciton `firstExcitonNm`): core size and
 * first-exciton extinction by Yu 2003 and by Jasieniak 2009, computed from both (each within its own range).
 */
export function cdseCurveComparison(firstExcitonNm: number, jasieniakInUse = false, shelled = false): string {
  const yu = SIZE_LAWS.cdse;
  const jas = CDSE_JASIENIAK_2009;
  const e = nmToEv(firstExcitonNm);
  const dYu = yu.diameterNm(e);
  const dJas = jas.diameterNm(e);
  const inRange = (law: typeof yu, d: number) => d >= law.diameterRangeNm[0] && d <= law.diameterRangeNm[1];
  if (!inRange(yu, dYu) || !inRange(jas, dJas))
    return (
      `The two published CdSe curves (Yu 2003, Jasieniak 2009) do not both cover a first exciton at ` +
      `${firstExcitonNm.toFixed(0)} nm; size and extinction rest on one curve only.`
    );
  const epsYu = yu.publishedExtinction(dYu)!;
  const epsJas = jas.publishedExtinction(dJas)!;
  const pct = (100 * (epsJas - epsYu)) / epsYu;
  return (
    `Published CdSe curves disagree at a first exciton of ${firstExcitonNm.toFixed(0)} nm` +
    `${shelled ? ' (sizes of the bare core with that first exciton)' : ''}: Yu 2003 gives a ` +
    `${dYu.toFixed(2)} nm core with ε ${epsYu.toExponential(2)}, Jasieniak 2009 a ${dJas.toFixed(2)} nm core with ` +
    `ε ${epsJas.toExponential(2)} M⁻¹ cm⁻¹ (${pct >= 0 ? '+' : ''}${pct.toFixed(0)} %; its extinction law is from ` +
    `memory, unverified). In use: ${jasieniakInUse ? 'Jasieniak 2009' : 'Yu 2003'}; either curve can be chosen ` +
    '(sizing curve; API field sizingModel).'
  );
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
    overallDiameterNm: null,
    hydrodynamicDiameterNm: rec.typicalHydrodynamicDiameterNm,
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
    overallDiameterNm: null,
    hydrodynamicDiameterNm: null,
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
    warnings.push(
      'Some of its numbers are approximate (from memory, unverified); the dye list (GET /api/v1/dyes) gives each ' +
        'source and how sure it is.',
    );
  const absorption = logNormalBandForNm(
    dye.absorptionPeakNm.value,
    dye.absorptionFwhmNm.value,
    dye.absorptionAsymmetry.value,
  );
  return {
    diameterNm: null,
    overallDiameterNm: null,
    hydrodynamicDiameterNm: null,
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
