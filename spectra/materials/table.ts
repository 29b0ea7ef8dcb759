import { SpectraError } from '../errors';
import { MATERIAL_IDS, type MaterialId } from '../panel';
import { SIZE_LAWS } from './laws';
import { BULK_PARAMS } from './params';
import { RECORDS } from './records';
import { emissionRangeForMaterialNm, isSizedMaterial } from './sizing';
import { TOXICITY } from './toxicity';
import type { Material } from './types';

/** Carbon dots: emission peaks accepted, nm (blue to deep red, as reported; from memory, unverified). */
export const CARBON_EMISSION_RANGE_NM: [number, number] = [400, 750];

function build(id: MaterialId): Material {
  const rec = RECORDS[id];
  const base = { id, ...rec, toxicity: TOXICITY[id] };
  if (isSizedMaterial(id)) {
    const law = SIZE_LAWS[id];
    const p = BULK_PARAMS[id];
    const [lo, hi] = emissionRangeForMaterialNm(id);
    return {
      ...base,
      sizeMeaning: law.sizeMeaning,
      diameterRangeNm: [law.diameterRangeNm[0], law.diameterRangeNm[1]],
      emissionRangeNm: [Math.round(lo * 10) / 10, Math.round(hi * 10) / 10],
      bulkBandGapEv: p.bandGapEv,
      electronMassRel: p.electronMassRel,
      holeMassRel: p.holeMassRel,
      dielectricConstant: p.dielectricConstant,
      bohrRadiusNm: p.bohrRadiusNm,
      sizingModel: law.model,
    };
  }
  return {
    ...base,
    sizeMeaning:
      id === 'carbon'
        ? 'no size law: carbon dots are described by their emission peak'
        : 'no size law: described by measured spectra',
    diameterRangeNm: null,
    emissionRangeNm: id === 'carbon' ? [...CARBON_EMISSION_RANGE_NM] : null,
    bulkBandGapEv: null,
    electronMassRel: null,
    holeMassRel: null,
    dielectricConstant: null,
    bohrRadiusNm: null,
    sizingModel: id === 'carbon' ? 'no size law (emission peak given; approximate excitation dependence)' : 'measured',
  };
}

let cache: Material[] | null = null;

/** Every material of the contract, in MATERIAL_IDS order; plain JSON-serialisable data, built once. */
export function listMaterials(): Material[] {
  cache ??= MATERIAL_IDS.map(build);
  return structuredClone(cache);
}

/** One material by id; `unknown_material` naming `material` otherwise. */
export function getMaterial(id: string): Material {
  const found = (cache ?? listMaterials()).find((m) => m.id === id);
  if (!found)
    throw new SpectraError(
      'unknown_material',
      `unknown material ${JSON.stringify(id)}; known: ${MATERIAL_IDS.join(', ')}`,
      ['material'],
    );
  return structuredClone(found);
}
