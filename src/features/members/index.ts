// The members feature's public face.
export { useMembers } from './api/get-members';
