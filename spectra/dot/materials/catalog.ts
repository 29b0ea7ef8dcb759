import { SpectraError } from '../../core/errors';
import { MATERIAL_IDS, type MaterialId } from '../../core/panel';
import { SIZE_LAWS } from '../sizing/laws';
import { BULK_PARAMS } from './params';
import { RECORDS } from './records';
import { emissionRangeForMaterialNm, isSizedMaterial } from '../sizing/sizing';
import { TOXICITY } from './toxicity';
import { CARBON_EMISSION_RANGE_NM } from '../sizing/carbon';
import type { Material } from './types';
import { TYPICAL_SHELLS } from '../shells/materials';
import { SIZING_MODELS } from '../../core/panel';

function build(id: MaterialId): Material {
  const rec = RECORDS[id];
  const base = { id, ...rec, toxicity: TOXICITY[id] };
  if (isSizedMaterial(id)) {
    const law = SIZE_LAWS[id];
    const p = BULK_PARAMS[id];
    const [lo, hi] = emissionRangeForMaterialNm(id);
    const shell = TYPICAL_SHELLS[id].map((layer) => ({ ...layer }));
    const [slo, shi] = emissionRangeForMaterialNm(id, { shell });
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
      sizingModels: id === 'cdse' ? [...SIZING_MODELS] : [],
      illustrative: law.illustrative,
      typicalShell: shell,
      typicalShellEmissionRangeNm: [Math.round(slo * 10) / 10, Math.round(shi * 10) / 10],
    };
  }
  return {
    ...base,
    sizeMeaning:
      id === 'carbon'
        ? 'no size law: carbon dots are described by their emission peak'
        : id === 'dye'
          ? "no size law: a dye of the dye library, named by the probe's dye field"
          : 'no size law: described by measured spectra',
    diameterRangeNm: null,
    emissionRangeNm: id === 'carbon' ? [...CARBON_EMISSION_RANGE_NM] : null,
    bulkBandGapEv: null,
    electronMassRel: null,
    holeMassRel: null,
    dielectricConstant: null,
    bohrRadiusNm: null,
    sizingModel:
      id === 'carbon'
        ? 'no size law (emission peak given; approximate excitation dependence)'
        : id === 'dye'
          ? 'dye library: log-normal absorption and emission bands (Siano & Metzler 1969)'
          : 'measured',
    sizingModels: [],
    illustrative: false,
    typicalShell: null,
    typicalShellEmissionRangeNm: null,
  };
}

// Material records are plain JSON data built from shared constants: callers get deep copies they may change.
function copy(material: Material): Material {
  return JSON.parse(JSON.stringify(material)) as Material;
}

let built: Material[] | null = null;

/** Every material of the contract, in MATERIAL_IDS order; plain JSON-serialisable data. */
export function listMaterials(): Material[] {
  built ??= MATERIAL_IDS.map(build);
  return built.map(copy);
}

/** One material by id; `unknown_material` naming `material` otherwise. */
export function getMaterial(id: string): Material {
  built ??= MATERIAL_IDS.map(build);
  const found = built.find((m) => m.id === id);
  if (!found)
    throw new SpectraError(
      'unknown_material',
      `unknown material ${JSON.stringify(id)}; known: ${MATERIAL_IDS.join(', ')}`,
      ['material'],
    );
  return copy(found);
}
