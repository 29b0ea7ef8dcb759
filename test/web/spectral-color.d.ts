// Types for the one part of spectral-color the tests use (its package exports carry no type entry).
declare module 'spectral-color' {
  /** A sampled distribution; sampleAt interpolates between the table's rows. */
  interface Distribution3 {
    sampleAt(wavelengthNm: number): [number, number, number];
  }
  export const cmfs: { CIE_1931_2DEG: Distribution3 };
}
