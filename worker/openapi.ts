import { z } from 'zod';
import packageJson from '../package.json';
import * as schemas from './schemas/index';
import { LIMITS } from './schemas/index';

type Json = Record<string, unknown>;

// Named component schemas: requests (as clients write them) and responses.
const COMPONENTS: [string, z.ZodType][] = [
  ['Panel', schemas.Panel],
  ['PanelRequest', schemas.PanelRequest],
  ['EvaluateRequest', schemas.EvaluateRequest],
  ['Instrument', schemas.Instrument],
  ['InstrumentCreated', schemas.InstrumentCreated],
  ['InstrumentList', schemas.InstrumentList],
  ['Filter', schemas.Filter],
  ['Probe', schemas.Probe],
  ['Channel', schemas.Channel],
  ['DotRequest', schemas.DotRequest],
  ['Error', schemas.ErrorBody],
  ['Health', schemas.Health],
  ['ShareCreated', schemas.ShareCreated],
  ['Material', schemas.Material],
  ['Detector', schemas.Detector],
  ['ResolvedDot', schemas.ResolvedDotJson],
  ['Evaluation', schemas.Evaluation],
  ['DesignRequest', schemas.DesignRequest],
  ['DesignResponse', schemas.DesignResponse],
  ['MaterialList', schemas.MaterialList],
  ['DetectorList', schemas.DetectorList],
  ['BackgroundPresetList', schemas.BackgroundPresetList],
  ['Dye', schemas.Dye],
  ['DyeList', schemas.DyeList],
  ['StockFilterList', schemas.StockFilterList],
  ['ControlsRequest', schemas.ControlsRequest],
  ['ControlsSpillover', schemas.ControlsSpillover],
];

const ref = (name: string): Json => ({ $ref: `#/components/schemas/${name}` });
const json = (schema: Json, description: string): Json => ({
  description,
  content: { 'application/json': { schema } },
});
// Every route can answer 404 (unknown id), 405 (wrong method) and 500 (never expected); routes with a body also 400,
// 413 and 415.
const anyRoute: Json = {
  '404': json(ref('Error'), 'unknown route or id'),
  '405': json(ref('Error'), 'wrong method (see the Allow header)'),
  '500': json(ref('Error'), 'an unexpected error (the tests show no input reaches it)'),
};
const withBody: Json = {
  '400': json(ref('Error'), 'bad input: the error names the field in `path`'),
  '413': json(ref('Error'), `body over ${LIMITS.bodyBytes / 1024} KiB`),
  '415': json(ref('Error'), 'body not sent as application/json'),
};
const get = (summary: string, ok: Json): Json => ({ get: { summary, responses: { '200': ok, ...anyRoute } } });
const post = (summary: string, body: string, responses: Json): Json => ({
  post: {
    summary,
    requestBody: { required: true, ...json(ref(body), body) },
    responses: { ...responses, ...withBody, ...anyRoute },
  },
});

function componentSchemas(): Json {
  const registry = z.registry<{ id: string }>();
  for (const [id, schema] of COMPONENTS) registry.add(schema, { id });
  const out = z.toJSONSchema(registry, {
    uri: (id) => `#/components/schemas/${id}`,
    io: 'input',
    unrepresentable: 'any',
  });
  // The document's own openapi/jsonSchemaDialect fields say which dialect applies; drop the per-schema headers.
  for (const schema of Object.values(out.schemas)) {
    delete (schema as Json).$schema;
    delete (schema as Json).$id;
  }
  return out.schemas as Json;
}

let cached: Json | undefined;

/** The OpenAPI 3.1 document of API v1, generated once per isolate from the zod schemas in worker/schemas/. */
export function openApiDocument(): Json {
  cached ??= {
    openapi: '3.1.0',
    jsonSchemaDialect: 'https://json-schema.org/draft/2020-12/schema',
    info: {
      title: 'qdpanel API',
      version: packageJson.version,
      description: 'The reference is docs/api.md in the repository.',
    },
    paths: {
      '/api/v1/health': get('liveness and version', json(ref('Health'), 'ok')),
      '/api/v1/openapi.json': get('this document', json({ type: 'object' }, 'OpenAPI 3.1')),
      '/api/v1/materials': get('materials with sizing ranges and cautions', json(ref('MaterialList'), 'ok')),
      '/api/v1/detectors': get('generic detector classes', json(ref('DetectorList'), 'ok')),
      '/api/v1/backgrounds': get(
        'autofluorescence presets by sample type: bands, sources, what level means, cautions',
        json(ref('BackgroundPresetList'), 'ok'),
      ),
      '/api/v1/dyes': get(
        'dyes, counterstains and fluorescent proteins, each number with its source and status',
        json(ref('DyeList'), 'ok'),
      ),
      '/api/v1/filters/stock': get(
        'stock bandpass sizes (centre/width pairs) and their rule',
        json(ref('StockFilterList'), 'ok'),
      ),
      '/api/v1/dots/resolve': post('one dot: size, peak, spectrum', 'DotRequest', {
        '200': json(ref('ResolvedDot'), 'ok'),
      }),
      '/api/v1/panels/evaluate': post('collected light, spillover, unmixing noise', 'EvaluateRequest', {
        '200': json(ref('Evaluation'), 'ok'),
      }),
      '/api/v1/controls/spillover': post(
        'measured spillover of single-stain controls, compared with the panel; FCS $SPILLOVER and unmixing matrix',
        'ControlsRequest',
        { '200': json(ref('ControlsSpillover'), 'ok') },
      ),
      '/api/v1/panels': post('store a panel behind a share link', 'PanelRequest', {
        '201': json(ref('ShareCreated'), 'stored (the same answer when it was stored before)'),
        '429': json(ref('Error'), 'too many share links from this client (see Retry-After)'),
      }),
      '/api/v1/panels/design': post(
        'propose dots and filters for a set of targets (exact on a catalog; best found under a node budget)',
        'DesignRequest',
        {
          '200': json(ref('DesignResponse'), 'the proposal, its evaluation, objective and search statistics'),
        },
      ),
      '/api/v1/panels/{id}': {
        get: {
          summary: 'a stored panel, exactly as it was sent',
          parameters: [
            { name: 'id', in: 'path', required: true, schema: { type: 'string', pattern: '^[A-Za-z0-9_-]{24}$' } },
          ],
          responses: { '200': json(ref('PanelRequest'), 'ok'), ...anyRoute },
        },
      },
      '/api/v1/instruments': {
        ...get('the example instrument profiles, with their ids and links', json(ref('InstrumentList'), 'ok')),
        ...post('store an instrument profile behind a link (/i/<id>)', 'Instrument', {
          '201': json(ref('InstrumentCreated'), 'stored (the same answer when it was stored before)'),
          '429': json(ref('Error'), 'too many share links from this client (see Retry-After)'),
        }),
      },
      '/api/v1/instruments/{id}': {
        get: {
          summary: 'a stored (or example) instrument profile, exactly as it was sent',
          parameters: [
            { name: 'id', in: 'path', required: true, schema: { type: 'string', pattern: '^[A-Za-z0-9_-]{24}$' } },
          ],
          responses: { '200': json(ref('Instrument'), 'ok'), ...anyRoute },
        },
      },
    },
    components: { schemas: componentSchemas() },
  };
  return cached;
}
