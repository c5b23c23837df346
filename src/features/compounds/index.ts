// The compounds feature's public face.
export { useCompounds } from './api/get-compounds';
