// fft.js ships loose generated typings (everything `any`); this declaration gives the parts lib/shape uses
// real types. Ambient module declarations take precedence over the package's own file.
declare module 'fft.js' {
  type NumericArray = number[] | Float64Array;
  /** Radix-4 complex FFT of a power-of-two size; arrays are interleaved [re0, im0, re1, im1, …]. */
  export default class FFT {
    constructor(size: number);
    readonly size: number;
    createComplexArray(): number[];
    /** Forward transform, X_k = Σ x_j e^{−2πijk/N}. `out` and `data` must differ. */
    transform(out: NumericArray, data: NumericArray): void;
    /** Inverse transform including the 1/N factor. `out` and `data` must differ. */
    inverseTransform(out: NumericArray, data: NumericArray): void;
    /** Forward transform of a real signal; fills the lower half of the spectrum. */
    realTransform(out: NumericArray, data: NumericArray): void;
    completeSpectrum(spectrum: NumericArray): void;
  }
}
