// The routes feature's public face: what other features may import.
export type { Draft, DraftConflict, Job, Percentiles, RouteDetail } from './api/schemas';
export { jobAcceptedSchema, jobSchema } from './api/schemas';
export { saveDraft } from './api/save-draft';
export { createRoute } from './api/create-route';
