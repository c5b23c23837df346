// The review feature's public face: revisions, their review and signatures, the attention list.
export {
  useComments,
  useCompare,
  useRevision,
  useRevisions,
  useSaveRevision,
} from './api/revisions';
export { AttentionList } from './components/attention-list';
export { CompareView } from './components/compare-view';
export { ReviewPanel } from './components/review-panel';
export { RevisionActions } from './components/save-revision';
export { SignatureRecord } from './components/signature';
export { StatusBadge } from './components/status-badge';
