import FFT from 'fft.js';

const plans = new Map<number, FFT>();

/**
 * A cached fft.js plan (radix-4 Cooley–Tukey) for a power-of-two size. Plans hold only twiddle tables and
 * scratch references, so sharing one per size is safe in single-threaded JavaScript.
 */
export function getFftPlan(size: number): FFT {
  let plan = plans.get(size);
  if (!plan) {
    plan = new FFT(size);
    plans.set(size, plan);
  }
  return plan;
}
