/**
 * The solvent library: 41 solvents used in work-ups and isolations. The records
 * live in shared/engine/data/solvents/*.ts by family; this module joins them in
 * a fixed order (the order is part of the data fingerprint tested in
 * tests/unit/data/solvents.test.ts).
 */
import type { SolventRecord } from './types';
import { WATER_ALCOHOLS_SOLVENTS } from './solvents/water-alcohols';
import { ESTERS_KETONES_SOLVENTS } from './solvents/esters-ketones';
import { ETHERS_SOLVENTS } from './solvents/ethers';
import { HYDROCARBONS_SOLVENTS } from './solvents/hydrocarbons';
import { HALOGENATED_SOLVENTS } from './solvents/halogenated';
import { POLAR_SOLVENTS } from './solvents/polar';

export const SOLVENTS: readonly SolventRecord[] = Object.freeze([
  ...WATER_ALCOHOLS_SOLVENTS,
  ...ESTERS_KETONES_SOLVENTS,
  ...ETHERS_SOLVENTS,
  ...HYDROCARBONS_SOLVENTS,
  ...HALOGENATED_SOLVENTS,
  ...POLAR_SOLVENTS,
]);
