/**
 * The pixel unmixing engine's shapes: a reference matrix (channels × probes) turned into an unmixer that a caller
 * runs over chunks of an image's pixels, writing into planes it allocated once.
 */

/** How each pixel is unmixed: non-negative least squares, or plain least squares (abundances may be negative). */
export type PixelUnmixMethod = 'nnls' | 'leastSquares';

/** The unmixed image: one abundance plane per probe and one residual plane, each one value per pixel. */
export interface PixelUnmixOutput {
  /** One plane per probe, in the reference's probe order; length = pixels. */
  abundances: Float32Array[];
  /** Per pixel: root-mean-square over channels of (measured − reference · abundance). */
  residual: Float32Array;
}

/** A reference matrix prepared once (checked, factorised); `unmixRange` then unmixes any run of pixels. */
export interface PixelUnmixer {
  readonly channels: number;
  readonly probes: number;
  /**
   * Unmixes pixels [from, to) of `planes` (one plane per channel, in the reference's channel order) into the same
   * pixels of `out`. Allocates nothing per pixel; a pixel with a non-finite value in any channel gets NaN throughout.
   */
  unmixRange(planes: readonly ArrayLike<number>[], from: number, to: number, out: PixelUnmixOutput): void;
}
