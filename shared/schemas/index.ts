export * from './errors';
export * from './limits';
export * from './session';
export * from './members';
export * from './password-reset';
export * from './tokens';
export * from './outbox';
export * from './health';
