// The spectral library's public surface changes only on purpose: this snapshot lists every exported runtime name
// with its kind. Adding or removing an export fails here until the snapshot is updated on purpose
// (`npx vitest run -u test/spectra/public-surface.test.ts`), and docs/architecture.md says what each group is for.
import { describe, expect, it } from 'vitest';
import * as spectra from '../../spectra/index';

describe('spectra/index public surface', () => {
  it('spectra/index exports exactly the snapshotted names and kinds', () => {
    const surface = Object.keys(spectra)
      .sort()
      .map((name) => `${name}: ${typeof (spectra as Record<string, unknown>)[name]}`);
    expect(surface).toMatchSnapshot();
  });
});
