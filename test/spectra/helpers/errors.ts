import { SpectraError } from '../../../spectra/index';

/** The SpectraError that `fn` throws; fails the test when it throws nothing or something else. */
export function errorOf(fn: () => unknown): SpectraError {
  try {
    fn();
  } catch (err) {
    if (err instanceof SpectraError) return err;
    throw err;
  }
  throw new Error('expected a SpectraError');
}
