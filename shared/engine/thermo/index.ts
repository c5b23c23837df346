export * from './antoine';
export * from './unifac';
export * from './vle';
export * from './nrtl';
export * from './mutual-solubility';
