/** Types of fft.js 4.0.4 (the package ships none): a radix-4 FFT on interleaved re/im arrays of a power-of-two size. */
declare module 'fft.js' {
  type NumericArray = number[] | Float64Array;
  export default class FFT {
    constructor(size: number);
    readonly size: number;
    createComplexArray(): number[];
    /** Forward transform of real input (length `size`) into `out` (2·size); only the first half plus one bin is filled. */
    realTransform(out: NumericArray, data: NumericArray): void;
    /** Fills the upper half of a spectrum produced by `realTransform` by conjugate symmetry. */
    completeSpectrum(spectrum: NumericArray): void;
    transform(out: NumericArray, data: NumericArray): void;
    /** Inverse transform, scaled by 1/size. */
    inverseTransform(out: NumericArray, data: NumericArray): void;
  }
}
