/**
 * Numerical methods shared by every solver in the engine: scalar root finding
 * with brackets and convergence flags (roots.ts) and adaptive ODE integration
 * with error control (ode.ts).
 */
export * from './roots';
export * from './ode';
