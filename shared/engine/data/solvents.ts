/**
 * The solvent library: 41 solvents used in work-ups and isolations. The
 * physical records live in shared/engine/data/solvents/*.ts by family; the
 * regulatory and hazard fields (ICH Q3C, flash point, peroxide former, static
 * accumulator) live in ich-q3c.ts and hazards.ts keyed by solvent id, and the
 * wide-range vapour-pressure correlations in vapour-pressure.ts, each value
 * with its source. This module joins them in a fixed order (the order
 * is part of the data fingerprint tested in tests/unit/data/solvents.test.ts).
 */
import type { SolventBaseRecord, SolventRecord } from './types';
import { WATER_ALCOHOLS_SOLVENTS } from './solvents/water-alcohols';
import { ESTERS_KETONES_SOLVENTS } from './solvents/esters-ketones';
import { ETHERS_SOLVENTS } from './solvents/ethers';
import { HYDROCARBONS_SOLVENTS } from './solvents/hydrocarbons';
import { HALOGENATED_SOLVENTS } from './solvents/halogenated';
import { POLAR_SOLVENTS } from './solvents/polar';
import { ICH_Q3C } from './ich-q3c';
import { SOLVENT_HAZARDS } from './hazards';
import { VAPOUR_PRESSURE_CORRELATIONS } from './vapour-pressure';

function withSafetyFields(base: SolventBaseRecord): SolventRecord {
  const ich = ICH_Q3C[base.id];
  const hazards = SOLVENT_HAZARDS[base.id];
  if (!ich || !hazards)
    throw new Error(`Solvent "${base.id}" has no ICH Q3C or hazard entry in the library.`);
  const vapourPressure = VAPOUR_PRESSURE_CORRELATIONS[base.id];
  return vapourPressure
    ? { ...base, ich, ...hazards, vapourPressure }
    : { ...base, ich, ...hazards };
}

export const SOLVENTS: readonly SolventRecord[] = Object.freeze(
  [
    ...WATER_ALCOHOLS_SOLVENTS,
    ...ESTERS_KETONES_SOLVENTS,
    ...ETHERS_SOLVENTS,
    ...HYDROCARBONS_SOLVENTS,
    ...HALOGENATED_SOLVENTS,
    ...POLAR_SOLVENTS,
  ].map(withSafetyFields),
);
