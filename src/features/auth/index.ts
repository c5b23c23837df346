// The auth feature's public face: what other features may import.
export { clearSessionEnd } from './session-end';
export { useSession } from './api/get-session';
export { canInWorkspace } from './abilities';
