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
