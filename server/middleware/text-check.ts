import type { RequestHandler } from 'express';
import { badRequest } from '../errors';

/** Half of a surrogate pair: a high surrogate not followed by a low one, or a low one alone. */
const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

/** Why a string cannot be taken as text, or null when it can. A NUL cannot be stored in a
 * PostgreSQL text column, and half of a surrogate pair is not Unicode at all (it breaks URL and
 * PDF encoding further on). */
function textProblem(value: string): string | null {
  if (value.includes('\u0000')) return 'holds a NUL character';
  if (LONE_SURROGATE.test(value)) return 'is not valid Unicode text (half of a surrogate pair)';
  return null;
}

/** Refuses a JSON body with unusable text anywhere in it (keys included), naming the field, before
 * any handler sees it. Walks without recursion: a deeply nested body cannot overflow the stack. */
export const textCheck: RequestHandler = (req, _res, next) => {
  const pending: Array<[unknown, string]> = [[req.body, '']];
  while (pending.length) {
    const [value, path] = pending.pop()!;
    if (typeof value === 'string') {
      const problem = textProblem(value);
      if (problem) return next(badRequest(`The text of ${path || 'the request'} ${problem}.`, { [path || '_']: `This text ${problem}.` }));
    } else if (value !== null && typeof value === 'object') {
      for (const [key, child] of Object.entries(value)) {
        const childPath = path ? `${path}.${key}` : key;
        const problem = textProblem(key);
        if (problem) return next(badRequest(`A field name in the request ${problem}.`, { _: `A field name ${problem}.` }));
        pending.push([child, childPath]);
      }
    }
  }
  next();
};
