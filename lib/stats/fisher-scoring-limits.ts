/** Stopping rules shared by the Fisher-scoring fits (`fitAtLapse`, `fitCommonSlope`). */

/** Fisher scoring converges quadratically near the optimum; 200 steps only matter for pathological data. */
export const MAX_ITERATIONS = 200;
/** Step halvings before a step is abandoned (2⁻⁴⁰ of a Newton step is below float resolution of the parameters). */
export const MAX_HALVINGS = 40;
/** Stop when an accepted step raises ℓ by less than this (absolute, natural-log units). */
export const LOG_LIKELIHOOD_TOLERANCE = 1e-11;
/** Keeps ψ(1 − ψ) away from 0 in the weights when λ = 0 and a level sits deep in a tail. */
export const VARIANCE_FLOOR = 1e-300;
/** Relative parameter change below which a step counts as no move (with a tiny gain, convergence). */
export const STEP_TOLERANCE = 1e-10;
/** Relative distance of the slope from a bound below which it counts as on that bound. */
export const BOUND_TOLERANCE = 1e-9;
