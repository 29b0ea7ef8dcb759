/**
 * JSON responses that never carry NaN or Infinity. The spectral library already answers null (with a warning) where
 * a number has no finite value; this replacer is only a safety net: it turns typed arrays into plain arrays, any
 * non-finite number into null, and then adds a warning to the body's `warnings` list saying so.
 */
export function finiteJsonResponse(value: unknown, status = 200): Response {
  let replaced = 0;
  const replacer = (_key: string, v: unknown): unknown => {
    if (ArrayBuffer.isView(v) && !(v instanceof DataView)) return Array.from(v as unknown as ArrayLike<number>);
    if (typeof v === 'number' && !Number.isFinite(v)) {
      replaced += 1;
      return null;
    }
    return v;
  };
  let text = JSON.stringify(value, replacer);
  if (replaced > 0) {
    const body = JSON.parse(text) as Record<string, unknown>;
    if (body !== null && typeof body === 'object' && !Array.isArray(body)) {
      const warnings = Array.isArray(body.warnings) ? body.warnings : [];
      warnings.push(`${replaced} value(s) had no finite result and are given as null`);
      body.warnings = warnings;
      text = JSON.stringify(body);
    }
  }
  return new Response(text, { status, headers: { 'content-type': 'application/json; charset=utf-8' } });
}
