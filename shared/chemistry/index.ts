/** Structure parsing, UNIFAC group assignment and structure-based estimates (openchemlib). */
export {
  parseStructure,
  loadGraph,
  type StructureInput,
  type ParsedStructure,
  type AtomGraph,
} from './structure';
export { assignUnifacGroups, type UnifacAssignment } from './unifac-groups';
export {
  estimateHansen,
  HVK_GROUPS,
  type HansenEstimate,
  type MolarVolumeInput,
} from './hansen-estimate';
export { structureFingerprint } from './fingerprint';
export {
  findIonisableGroups,
  PKA_METHOD,
  PKA_TYPICAL_ERROR,
  type IonisableGroup,
} from './pka-estimate';
export { atomContributionLogP, missingGroupNames, LOGP_FALLBACK_METHOD } from './logp-fallback';
