import { describe, expect, it } from 'vitest';
import { SpectraError, allocateUnmixOutput, pixelUnmixer, type PixelUnmixMethod } from '../../spectra/index';
import { errorOf } from './helpers/errors';

const REFERENCE = [
  [1, 0.2],
  [0.1, 1],
  [0.05, 0.3],
];

describe('pixelUnmixer refusals', () => {
  it.each([
    [[], 'The reference matrix has no channels: give one row of probe values per channel', ['reference']],
    [[[], []], 'The reference matrix has no probes: each channel row needs one value per probe', ['reference', 0]],
    [
      [[1, 2], [3]],
      'Reference row 2 has 1 values but row 1 has 2: every channel needs one value per probe',
      ['reference', 1],
    ],
    [
      [
        [1, 2],
        [3, NaN],
      ],
      'Reference value for channel 2, probe 2 is NaN, not a finite number',
      ['reference', 1, 1],
    ],
    [
      [
        [1, 2],
        [3, Infinity],
      ],
      'Reference value for channel 2, probe 2 is Infinity, not a finite number',
      ['reference', 1, 1],
    ],
    [
      [
        [1, 2, 3],
        [4, 5, 6],
      ],
      'The reference has 3 probes but only 2 channels: unmixing needs at least as many channels as probes',
      ['reference'],
    ],
    [
      [
        [1, 0],
        [2, 0],
        [3, 0],
      ],
      'Probe 2 gives no signal in any channel of the reference: it cannot be unmixed',
      ['reference'],
    ],
    [
      [
        [1, 2],
        [2, 4],
        [3, 6],
      ],
      "The probes' reference spectra are linearly dependent (rank-deficient): they cannot be unmixed",
      ['reference'],
    ],
  ])('pixelUnmixer(%j) throws SpectraError "%s" naming the field', (reference, message, path) => {
    for (const method of ['nnls', 'leastSquares'] as const) {
      const err = errorOf(() => pixelUnmixer(reference as number[][], method));
      expect([err.code, err.message, err.path]).toEqual(['invalid_input', message, path]);
    }
  });

  it("pixelUnmixer with a method other than 'nnls' or 'leastSquares' throws naming the method", () => {
    const err = errorOf(() => pixelUnmixer(REFERENCE, 'pinv' as PixelUnmixMethod));
    expect([err.message, err.path]).toEqual([
      "Unknown unmixing method 'pinv': use 'nnls' or 'leastSquares'",
      ['method'],
    ]);
  });

  it.each(['nnls', 'leastSquares'] as const)(
    'unmixRange (%s) refuses planes, ranges and outputs that do not fit',
    (method) => {
      const unmixer = pixelUnmixer(REFERENCE, method);
      const out = allocateUnmixOutput(2, 4);
      const planes = [new Float32Array(4), new Uint16Array(4), new Float32Array(4)];
      const cases: [() => void, string, (string | number)[]][] = [
        [
          () => unmixer.unmixRange(planes.slice(0, 2), 0, 4, out),
          '2 image planes were given but the reference has 3 channels: give one plane per channel',
          ['planes'],
        ],
        [
          () => unmixer.unmixRange([planes[0], planes[1], new Float32Array(5)], 0, 4, out),
          'Image plane 3 has 5 pixels but plane 1 has 4: every channel plane must be the same size',
          ['planes', 2],
        ],
        [
          () => unmixer.unmixRange(planes, 2, 5, out),
          "Pixel range 2 to 5 is not within the image's 4 pixels",
          ['range'],
        ],
        [
          () => unmixer.unmixRange(planes, 3, 2, out),
          "Pixel range 3 to 2 is not within the image's 4 pixels",
          ['range'],
        ],
        [
          () => unmixer.unmixRange(planes, 0.5, 2, out),
          "Pixel range 0.5 to 2 is not within the image's 4 pixels",
          ['range'],
        ],
        [
          () => unmixer.unmixRange(planes, 0, 4, allocateUnmixOutput(3, 4)),
          'The output has 3 abundance planes but the reference has 2 probes',
          ['out'],
        ],
        [
          () => unmixer.unmixRange(planes, 0, 4, allocateUnmixOutput(2, 3)),
          'The output holds 3 pixels but the range ends at pixel 4',
          ['out'],
        ],
      ];
      for (const [run, message, path] of cases) {
        const err = errorOf(run);
        expect(err).toBeInstanceOf(SpectraError);
        expect([err.message, err.path]).toEqual([message, path]);
      }
      expect(() => unmixer.unmixRange(planes, 1, 1, out)).not.toThrow();
    },
  );

  it('allocateUnmixOutput(probes, pixels) gives zeroed planes and refuses a probe count below 1', () => {
    const out = allocateUnmixOutput(3, 5);
    expect(out.abundances.map((p) => Array.from(p))).toEqual([0, 0, 0].map(() => [0, 0, 0, 0, 0]));
    expect(Array.from(out.residual)).toEqual([0, 0, 0, 0, 0]);
    expect(errorOf(() => allocateUnmixOutput(0, 5)).message).toBe(
      'An unmixed image needs a whole number of probes (at least 1) and of pixels, got 0 and 5',
    );
  });
});
