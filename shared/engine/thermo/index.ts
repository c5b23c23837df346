export * from './antoine';
export * from './unifac';
export * from './vle';
