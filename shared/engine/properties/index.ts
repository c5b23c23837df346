/** Property models: Hansen parameters, solubility, partition and logP. */
export * from './hansen';
export * from './solubility';
export * from './partition';
export {
  gammaInfiniteDilution,
  OCTANOL_GROUPS,
  WATER_GROUPS,
  X_OCTANOL_IN_AQUEOUS,
  X_OCTANOL_IN_ORGANIC,
  V_OCTANOL_M3MOL,
  V_WATER_M3MOL,
  WATER_DENSITY_25C_GML,
  WATER_MOLAR_MASS_GMOL,
} from './logp';
export { tanimotoHex, CLOSE_ANALOGUE_TANIMOTO } from './similarity';
