/**
 * The request the "Propose a panel" form sends, built from what the user typed and chose: targets with their locks,
 * the lines, catalog mode's candidates or free mode's limits, the probes and channels the locks name (sent as
 * `owned` in free mode) and the microscope whose channels free mode chooses among. Pure, so tests can read it.
 */
import {
  foldLightPath,
  SpectraError,
  type AbundanceInput,
  type ChannelSpec,
  type DesignLock,
  type DesignOptions,
  type ExcitationLine,
  type Exclusion,
  type MaterialId,
  type MeasuredReferenceSpec,
  type PanelSpec,
  type ProbeSpec,
} from '../../spectra/index';
import type { DesignRequest } from '../../worker/schemas';

/** Probes and channels as a design takes them (candidates, or what the user owns). */
export interface DesignParts {
  probes: ProbeSpec[];
  channels: ChannelSpec[];
}

/**
 * The panel's probes (without their channel choice) and channels as a design takes them: each channel with the
 * panel's shared light path in front of its own filters, as the panel is evaluated (a panel whose light path cannot
 * be folded, which the page marks anyway, gives its channels as written).
 */
export function designParts(panel: PanelSpec): DesignParts {
  let channels = panel.channels;
  if (panel.lightPath && panel.excitation.length > 0) {
    try {
      channels = foldLightPath(panel).channels;
    } catch (e) {
      if (!(e instanceof SpectraError)) throw e;
    }
  }
  return { probes: panel.probes.map(({ channel: _c, ...probe }) => probe), channels };
}

/** What the form holds when Propose is pressed, its texts already read as values. */
export interface DesignInput {
  targets: { name: string; abundance: AbundanceInput; lock?: DesignLock }[];
  /** The lines; absent when the microscope's lines are to be used. */
  excitation?: ExcitationLine[];
  /** Catalog mode: the probes and channels to choose among (locks then name these). */
  candidates?: DesignParts;
  /** Catalog mode: the panel's measured reference columns, which the search then uses for the probes they cover. */
  measuredReference?: MeasuredReferenceSpec;
  /** Free mode: what the user owns (the panel's parts); the locked ones are sent as `owned`. */
  owned: DesignParts;
  free: { exclude: Exclusion[]; allowedMaterials: MaterialId[]; windowNm: [number, number] };
  /** Free mode: the id of the instrument profile whose channels to choose among. */
  instrument?: string;
  options: DesignOptions;
  sample: Pick<DesignRequest, 'scatterLevel' | 'waterRaman'>;
}

/** A lock without its empty choices; undefined when it names nothing. */
function lockOf(lock: DesignLock | undefined): DesignLock | undefined {
  const probe = lock?.probe ? { probe: lock.probe } : {};
  const channel = lock?.channel ? { channel: lock.channel } : {};
  return lock?.probe || lock?.channel ? { ...probe, ...channel } : undefined;
}

/** The owned probes and channels some target locks (undefined when none is locked). */
function lockedParts(targets: DesignRequest['targets'], owned: DesignParts): DesignRequest['owned'] {
  const probeIds = new Set(targets.flatMap((t) => (t.lock?.probe ? [t.lock.probe] : [])));
  const channelIds = new Set(targets.flatMap((t) => (t.lock?.channel ? [t.lock.channel] : [])));
  const probes = owned.probes.filter((p) => probeIds.has(p.id));
  const channels = owned.channels.filter((c) => channelIds.has(c.id));
  if (!probes.length && !channels.length) return undefined;
  return { ...(probes.length ? { probes } : {}), ...(channels.length ? { channels } : {}) };
}

/**
 * The design request: in catalog mode the candidates, which the locks name; in free mode the limits, the locked
 * probes and channels as `owned`, and the instrument when its channels are to be chosen among.
 */
export function designRequest(input: DesignInput): DesignRequest {
  const targets = input.targets.map((t) => {
    const lock = lockOf(t.lock);
    return { name: t.name.trim(), abundance: t.abundance, ...(lock ? { lock } : {}) };
  });
  const base = {
    targets,
    ...(input.excitation ? { excitation: input.excitation } : {}),
    options: input.options,
    ...input.sample,
  };
  if (input.candidates)
    return {
      ...base,
      candidates: input.candidates,
      ...(input.measuredReference ? { measuredReference: input.measuredReference } : {}),
    };
  const owned = lockedParts(targets, input.owned);
  return {
    ...base,
    exclude: input.free.exclude,
    allowedMaterials: input.free.allowedMaterials,
    windowNm: input.free.windowNm,
    ...(owned ? { owned } : {}),
    ...(input.instrument !== undefined ? { instrument: input.instrument } : {}),
  };
}
