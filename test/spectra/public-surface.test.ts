// The public surface of the spectral library changes only on purpose: this snapshot lists every exported name with
// its kind. Adding or removing an export fails here until the snapshot is updated (`npx vitest run -u` on purpose).
import { describe, expect, it } from 'vitest';
import * as spectra from '../../spectra/index';

describe('spectra/index public surface', () => {
  it('spectra/index exports exactly the snapshotted names and kinds', () => {
    const surface = Object.keys(spectra)
      .sort()
      .map((name) => `${name}: ${typeof (spectra as Record<string, unknown>)[name]}`);
    expect(surface).toMatchSnapshot();
  });

  it('spectra/index holds no logic: every export is defined', () => {
    for (const [name, value] of Object.entries(spectra)) expect(value, name).toBeDefined();
  });
});
