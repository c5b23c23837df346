// The members feature's public face.
export { useMembersWithRole } from './api/get-members';
