// The audit feature's public face.
export { AuditTrail } from './components/audit-trail';
