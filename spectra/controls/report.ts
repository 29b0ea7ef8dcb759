/**
 * Everything the controls route and the page show for one set of controls: the measured spillover with its errors,
 * the comparison with the panel's model (when a panel is given), the FCS 3.1 $SPILLOVER value and the unmixing matrix
 * (null, each with the reason in `warnings`, when they cannot be made).
 */
import type { PanelSpec } from '../core/panel';
import { SpectraError } from '../core/errors';
import { compareSpillover, type SpilloverComparison } from './comparison';
import { fcsSpillover } from './fcs-spillover';
import { measuredSpillover } from './spillover';
import type { ControlsMeasurement, MeasuredSpillover } from './types';
import { unmixingMatrix } from './unmixing';

/** The measured spillover and what is made from it. */
export interface ControlsReport extends MeasuredSpillover {
  /** Measured against predicted, [c][p] in the measured order; null without a panel. */
  comparison: SpilloverComparison | null;
  /** The FCS 3.1 $SPILLOVER keyword value of the measured matrix, or null (the reason is in `warnings`). */
  fcsSpillover: string | null;
  /** The pseudo-inverse [p][c] of the measured spillover, or null (the reason is in `warnings`). */
  unmixing: number[][] | null;
}

/** The controls report; bad input throws SpectraError naming the field. */
export function controlsReport(m: ControlsMeasurement, panel?: PanelSpec): ControlsReport {
  const measured = measuredSpillover(m, panel);
  const warnings = [...measured.warnings];
  const fcs = fcsSpillover(measured);
  if (!fcs.ok) warnings.push(`no FCS $SPILLOVER value: ${fcs.reason}`);
  let unmixing: number[][] | null = null;
  try {
    unmixing = unmixingMatrix(measured.spillover);
  } catch (e) {
    if (!(e instanceof SpectraError)) throw e;
    warnings.push(`no unmixing matrix: ${e.message}`);
  }
  return {
    ...measured,
    comparison: panel ? compareSpillover(measured, panel) : null,
    fcsSpillover: fcs.ok ? fcs.text : null,
    unmixing,
    warnings,
  };
}
