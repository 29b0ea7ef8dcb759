import { z } from 'zod';
import { identifier, ranged } from './fields';
import { LIMITS, RANGES } from './limits';
import { Panel } from './panel';

// Single-stain controls (docs/api.md, "POST /api/v1/controls/spillover"): the request, shared with the page's CSV
// import and the image's region measurements, and the answer.

const signals = () =>
  z
    .array(ranged(RANGES.measuredSignal[0], RANGES.measuredSignal[1]), { error: 'must be a list of numbers' })
    .min(1, { error: 'needs one value per channel' })
    .max(LIMITS.channels, { error: `must have at most ${LIMITS.channels} values (one per channel)` });
const sds = () =>
  z
    .array(ranged(RANGES.measuredSd[0], RANGES.measuredSd[1]), { error: 'must be a list of numbers' })
    .max(LIMITS.channels, { error: `must have at most ${LIMITS.channels} values (one per channel)` });
const readings = () =>
  ranged(RANGES.readings[0], RANGES.readings[1]).int({ error: 'must be a whole number of readings' });

/** One control row: a probe stained alone, its mean per channel, optionally the sd of its `n` readings. */
export const ControlRow = z.strictObject({
  probe: identifier(),
  values: signals(),
  sd: sds().optional(),
  n: readings().optional(),
});

const controlsFields = {
  channels: z
    .array(identifier(), { error: 'must be a list of channel ids' })
    .min(1, { error: 'needs at least one channel' })
    .max(LIMITS.channels, { error: `must have at most ${LIMITS.channels} channels` }),
  unstained: signals(),
  unstainedSd: sds().optional(),
  unstainedN: readings().optional(),
  controls: z
    .array(ControlRow, { error: 'must be a list of controls' })
    .min(1, { error: 'needs at least one single-stain control' })
    .max(LIMITS.controlRows, { error: `must have at most ${LIMITS.controlRows} rows` }),
};

type ControlsShape = { channels: string[]; controls: { probe: string }[] };

/** Channel ids unique; at most LIMITS.controlReplicates rows for one probe. */
function checkControls(m: ControlsShape, ctx: z.RefinementCtx): void {
  const issue = (message: string, path: (string | number)[]) =>
    ctx.addIssue({ code: 'custom', message, path, params: { apiCode: 'invalid_input' } });
  const seen = new Set<string>();
  m.channels.forEach((id, i) => {
    if (seen.has(id)) issue(`channel ${id} is listed twice`, ['channels', i]);
    seen.add(id);
  });
  const rows = new Map<string, number>();
  m.controls.forEach((row, i) => {
    const count = (rows.get(row.probe) ?? 0) + 1;
    rows.set(row.probe, count);
    if (count === LIMITS.controlReplicates + 1) {
      issue(`probe ${row.probe} has more than ${LIMITS.controlReplicates} replicate rows`, ['controls', i]);
    }
  });
}

/** Controls as measured (spectra's ControlsMeasurement). */
export const ControlsInput = z.strictObject(controlsFields).superRefine(checkControls);

/** What POST /api/v1/controls/spillover takes: the controls and, optionally, the panel they were planned with. */
export const ControlsRequest = z
  .strictObject({ ...controlsFields, panel: Panel.optional() })
  .superRefine(checkControls);

const nullableMatrix = z.array(z.array(z.number().nullable()));

/** One measured entry against the model: the prediction, its lot-shift band, the flag and its sentence. */
export const ComparedEntryJson = z.strictObject({
  predicted: z.number().nullable(),
  band: z.tuple([z.number(), z.number()]).nullable(),
  flagged: z.boolean(),
  sentence: z.string().nullable(),
});

/** POST /api/v1/controls/spillover's answer (spectra's ControlsReport). */
export const ControlsSpillover = z.strictObject({
  channels: z.array(z.string()),
  probes: z.array(z.string()),
  signal: z.array(z.array(z.number())),
  spillover: z.array(z.array(z.number())),
  se: nullableMatrix,
  primaryChannel: z.array(z.number().int()),
  replicates: z.array(z.number().int()),
  comparison: z
    .strictObject({ entries: z.array(z.array(ComparedEntryJson)), sentences: z.array(z.string()) })
    .nullable(),
  fcsSpillover: z.string().nullable(),
  unmixing: z.array(z.array(z.number())).nullable(),
  warnings: z.array(z.string()),
});
