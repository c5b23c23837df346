/**
 * Numerical methods shared by every solver in the engine: scalar root finding
 * with brackets and convergence flags (roots.ts), adaptive ODE integration
 * with error control (ode.ts) and nonlinear least squares (least-squares.ts).
 */
export * from './roots';
export * from './ode';
export * from './least-squares';
