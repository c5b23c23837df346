/** The plant step list: scaling a route to a batch and writing it out as numbered operations. */
export { applyEquipment, scaleDocument, scaleFactorFor } from './scale';
export { buildStepList, IPC_MARGIN, type BuiltStepList, type StepListInput } from './build';
