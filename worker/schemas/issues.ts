/**
 * How a schema's complaint reads: one zod issue becomes the contract's error fields (a machine code, a sentence that
 * names the field as people write it, and its path). The API's validator and the page both use it, so a bad input
 * gets the same words in both.
 */
import type { z } from 'zod';
import type { ApiErrorCode } from './errors';

type Path = (string | number)[];
type Issue = z.core.$ZodIssue;

/** A path as people write it: `probes[0].emissionPeakNm` (the body itself is `body`). */
export function pathText(path: Path): string {
  if (path.length === 0) return 'body';
  return path.map((part, i) => (typeof part === 'number' ? `[${part}]` : i === 0 ? part : `.${part}`)).join('');
}

/** The contract's error fields for one zod issue: a machine code, a sentence naming the field, and its path. */
export function issueToError(issue: Issue): { code: ApiErrorCode; message: string; path: Path } {
  const path = issue.path.filter((p): p is string | number => typeof p !== 'symbol');
  const last = path[path.length - 1];
  const inTable = path.includes('points');
  switch (issue.code) {
    case 'unrecognized_keys': {
      const key = issue.keys[0];
      return {
        code: 'invalid_input',
        message: `${pathText([...path, key])} is not a known field`,
        path: [...path, key],
      };
    }
    case 'invalid_union':
      if ('discriminator' in issue && issue.discriminator === 'type') {
        const options = (issue as { options?: unknown[] }).options ?? [];
        const message = `${pathText(path)} must be one of ${options.join(', ')}`;
        return { code: 'unknown_filter_type', message, path };
      }
      break;
    case 'invalid_value':
      if (last === 'material') return { code: 'unknown_material', message: `${pathText(path)} ${issue.message}`, path };
      if (last === 'detector') return { code: 'unknown_detector', message: `${pathText(path)} ${issue.message}`, path };
      break;
    case 'too_small':
    case 'too_big':
      if (issue.origin === 'number') {
        return {
          code: inTable ? 'invalid_table' : 'out_of_range',
          message: `${pathText(path)} ${issue.message}`,
          path,
        };
      }
      break;
    case 'custom': {
      const apiCode = (issue.params as { apiCode?: ApiErrorCode } | undefined)?.apiCode;
      if (apiCode) return { code: apiCode, message: `${pathText(path)} ${issue.message}`, path };
      break;
    }
  }
  return { code: inTable ? 'invalid_table' : 'invalid_input', message: `${pathText(path)} ${issue.message}`, path };
}
