import { Hono } from 'hono';
import { controlsReport } from '../../spectra/index';
import type { AppEnv } from '../env';
import { finiteJsonResponse } from '../json';
import { jsonBody } from '../middleware/json-body';
import { ControlsRequest } from '../schemas/index';
import { validJson } from '../validation';

/**
 * Controls: POST /api/v1/controls/spillover turns measured single-stain controls and an unstained sample into the
 * measured spillover with its standard errors, compares it with the panel's model when the panel is given, and
 * writes the FCS 3.1 $SPILLOVER value and the unmixing matrix.
 */
export const controls = new Hono<AppEnv>().post('/spillover', jsonBody(), validJson(ControlsRequest), (c) => {
  const { panel, ...measurement } = c.req.valid('json');
  return finiteJsonResponse(controlsReport(measurement, panel));
});
