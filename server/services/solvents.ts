/** The solvent library as the API presents it: every value with its source. */
import type { SolventDetail, SolventSummary, ValueSource } from '@shared/schemas/solvents';
import {
  SOLVENT_DATA_VERSION,
  SOLVENTS,
  solventById,
  type SolventRecord,
} from '@shared/engine/data';
import { guideCategoryOf, SOLVENT_GUIDE_SOURCE } from '@shared/engine/data/solvent-guide';
import { notFound } from '../errors';
import { presentSource, subgroupRows } from './components';

export function listSolvents(): SolventSummary[] {
  return SOLVENTS.map(presentSolventSummary).sort((a, b) => a.name.localeCompare(b.name));
}

export function getSolvent(id: string): SolventDetail {
  const solvent = solventById(id);
  if (!solvent) throw notFound('The solvent');
  return presentSolventDetail(solvent);
}

function sources(s: SolventRecord): Record<string, ValueSource> {
  const out: Record<string, ValueSource> = {
    molarMassGmol: presentSource(s.molarMassGmol.source),
    densityGmL: presentSource(s.density.source),
    boilingPointC: presentSource(s.boilingPointC.source),
    meltingPointC: presentSource(s.meltingPointC.source),
    flashPointC: presentSource(s.flashPointC.source),
    hansen: presentSource(s.hansen.source),
    unifac: presentSource(s.unifac.source),
    viscosityMPas25C: presentSource(s.viscosityMPas25C.source),
    ich: presentSource(s.ich.source),
    peroxideFormer: presentSource(s.peroxideFormer.source),
    lowConductivity: presentSource(s.lowConductivity.source),
  };
  // The guide category is read from the guide's table (solvent-guide.ts), never
  // recalled; a solvent the table does not list has no category and no source.
  if (guideCategoryOf(s.id)) out.guideCategory = presentSource(SOLVENT_GUIDE_SOURCE);
  if (s.enthalpyVapKJmol) out.enthalpyVapKJmol = presentSource(s.enthalpyVapKJmol.source);
  if (s.molarVolumeCm3mol) out.molarVolumeCm3mol = presentSource(s.molarVolumeCm3mol.source);
  if (s.waterMutualSolubility)
    out.waterMutualSolubility = presentSource(s.waterMutualSolubility.source);
  if (s.dielectricConstant) out.dielectricConstant = presentSource(s.dielectricConstant.source);
  return out;
}

export function presentSolventSummary(s: SolventRecord): SolventSummary {
  return {
    id: s.id,
    name: s.name,
    synonyms: [...(s.synonyms ?? [])],
    smiles: s.smiles,
    cas: s.cas,
    molarMassGmol: s.molarMassGmol.value,
    ich: { class: s.ich.value.class, limitPpm: s.ich.value.limitPpm },
    boilingPointC: s.boilingPointC.value,
    meltingPointC: s.meltingPointC.value,
    densityGmL: s.density.value.gPerMl,
    densityTemperatureC: s.density.value.temperatureC,
    flashPointC: s.flashPointC.value,
    hansen: { ...s.hansen.value },
    viscosityMPas25C: s.viscosityMPas25C.value,
    peroxideFormer: s.peroxideFormer.value,
    lowConductivity: s.lowConductivity.value,
    guideCategory: guideCategoryOf(s.id),
    waterMiscibility: s.waterMiscibility,
    unifac: subgroupRows(s.unifac.value),
    sources: sources(s),
  };
}

export function presentSolventDetail(s: SolventRecord): SolventDetail {
  return {
    ...presentSolventSummary(s),
    antoine: s.antoine.map((set) => ({
      form: set.form,
      A: set.A,
      B: set.B,
      C: set.C,
      TminK: set.TminK,
      TmaxK: set.TmaxK,
      source: presentSource(set.source),
    })),
    enthalpyVapKJmol: s.enthalpyVapKJmol?.value ?? null,
    molarVolumeCm3mol: s.molarVolumeCm3mol?.value ?? null,
    densityPerK: s.density.value.dPerK ?? null,
    pdeMgDay: s.ich.value.pdeMgDay ?? null,
    dielectricConstant: s.dielectricConstant?.value ?? null,
    waterMutualSolubility: s.waterMutualSolubility ? { ...s.waterMutualSolubility.value } : null,
    dataVersion: SOLVENT_DATA_VERSION,
  };
}
