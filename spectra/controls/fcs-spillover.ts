/**
 * The FCS 3.1 `$SPILLOVER` keyword value (Spidlen et al., "Data File Standard for Flow Cytometry, version FCS 3.1",
 * Cytometry A 2010, 77, 97; the $SPILLOVER keyword among the TEXT segment keywords, section 3.2; from memory,
 * unverified): n, the n parameter names, then the n × n coefficients row by row, all separated by commas, where row i
 * is the fluorochrome whose primary detector is parameter i and column j its spill into parameter j. Names containing
 * a comma are refused rather than escaped (the value's own separator is the comma, which the standard does not escape
 * inside this value); the TEXT segment's delimiter is the writer's choice and is doubled there, not here.
 */

/** A spillover matrix [c][p] with each probe's primary channel, as measured or predicted. */
export interface SpilloverMatrix {
  channels: readonly string[];
  probes: readonly string[];
  spillover: readonly (readonly (number | null)[])[];
  primaryChannel: readonly (number | null)[];
}

/** The keyword's value, or the reason it cannot be square. */
export type FcsSpilloverResult = { ok: true; text: string } | { ok: false; reason: string };

/** The `$SPILLOVER` value of a spillover matrix, parameters being the probes' primary channels in probe order. */
export function fcsSpillover(m: SpilloverMatrix): FcsSpilloverResult {
  const seen = new Map<number, string>();
  for (let p = 0; p < m.probes.length; p++) {
    const c = m.primaryChannel[p];
    if (c === null) return { ok: false, reason: `probe ${m.probes[p]} has no primary channel` };
    const other = seen.get(c);
    if (other !== undefined) {
      return {
        ok: false,
        reason:
          `probes ${other} and ${m.probes[p]} share the primary channel ${m.channels[c]}: ` +
          'the matrix cannot be square',
      };
    }
    seen.set(c, m.probes[p]);
  }
  const params = m.primaryChannel.map((c) => c!);
  const names = params.map((c) => m.channels[c]);
  const bad = names.find((n) => n.includes(','));
  if (bad !== undefined) return { ok: false, reason: `channel name "${bad}" contains a comma, the value's separator` };
  const values: number[] = [];
  for (let i = 0; i < params.length; i++) {
    for (const c of params) {
      const v = m.spillover[c][i];
      if (v === null || !Number.isFinite(v)) {
        return { ok: false, reason: `the spill of ${m.probes[i]} into ${m.channels[c]} is undefined` };
      }
      values.push(v);
    }
  }
  return { ok: true, text: [String(params.length), ...names, ...values.map(String)].join(',') };
}
