/** The solvent substitution advisor (docs/methods.md, "Solvent substitution advisor"). */
export * from './roles';
export * from './facts';
export * from './alternatives';
