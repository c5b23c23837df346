/**
 * The figures of the advisor's rule for a substitute that keeps the yield and
 * purity (keepsYieldAndPurity in ./alternatives), apart so the screen that
 * explains a verdict reads them without loading the engine.
 */

/** A substitute keeps the yield when it is at most this many percentage points below the current route's. */
export const YIELD_WINDOW_POINTS = 2;
/** Round-off allowed when comparing solvent-free purities [percentage points]. */
export const PURITY_TOLERANCE_POINTS = 1e-9;
