/**
 * Instrument profiles on the server: the example profiles every installation serves (under the unkeyed ids of their
 * content, the same on every installation: they are public, and stored panels name them by these ids) and the
 * resolution of a panel that names a profile.
 */
import { EXAMPLE_INSTRUMENTS, resolveOnInstrument, type InstrumentSpec } from '../spectra/index';
import { ApiError, issueToError, Panel } from './schemas/index';
import type { PanelRequest } from './schemas/index';
import { canonicalJson, unkeyedShareIdOf } from './share-id';
import { loadSharedText } from './store';

/** An example profile with its id and canonical text. */
export interface ExampleInstrument {
  id: string;
  text: string;
  spec: InstrumentSpec;
}

let examples: Promise<ExampleInstrument[]> | undefined;

/** The example profiles with their ids (computed once per isolate). */
export function exampleInstruments(): Promise<ExampleInstrument[]> {
  examples ??= Promise.all(
    EXAMPLE_INSTRUMENTS.map(async (spec) => {
      const text = canonicalJson(spec);
      return { id: await unkeyedShareIdOf(text), text, spec };
    }),
  );
  return examples;
}

/** The id of the example profile with the same canonical text as `value`, or undefined when it is none. */
export async function exampleIdOf(value: unknown): Promise<string | undefined> {
  const text = canonicalJson(value);
  return (await exampleInstruments()).find((e) => e.text === text)?.id;
}

/** A profile's canonical text: an example's, or the stored one (one storage read), or null when there is none. */
export async function loadInstrumentText(kv: KVNamespace, id: string): Promise<string | null> {
  const example = (await exampleInstruments()).find((e) => e.id === id);
  return example ? example.text : loadSharedText(kv, 'instrument', id);
}

/**
 * The profile a request names by `instrument` (one storage read); an unknown id is a 400 unknown_instrument naming
 * `instrument`.
 */
export async function loadInstrumentProfile(kv: KVNamespace, id: string): Promise<InstrumentSpec> {
  const text = await loadInstrumentText(kv, id);
  if (text === null) {
    throw new ApiError(
      400,
      'unknown_instrument',
      `no instrument profile is stored under '${id}' (check the link, or store the profile with ` +
        'POST /api/v1/instruments)',
      ['instrument'],
    );
  }
  return JSON.parse(text) as InstrumentSpec;
}

/**
 * The panel with every part written out: a panel that names an instrument reads the profile (one storage read) and
 * takes its parts from it; an unknown id is a 400 naming `instrument`. The written-out panel is checked like any
 * panel, so a probe naming a channel the instrument lacks is refused with the probe's path.
 */
export async function resolvePanelRequest(kv: KVNamespace, panel: PanelRequest): Promise<Panel> {
  if (panel.instrument === undefined) return resolveOnInstrument(panel, undefined) as Panel;
  const written = resolveOnInstrument(panel, await loadInstrumentProfile(kv, panel.instrument));
  const checked = Panel.safeParse(written);
  if (!checked.success) {
    const first = issueToError(checked.error.issues[0]);
    throw new ApiError(400, first.code, first.message, first.path);
  }
  return checked.data;
}
