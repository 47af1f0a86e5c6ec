// Lists that may be long (epochs, batch items): each element is checked on its own first and the
// check stops after MAX_LISTED_ISSUES bad elements, so a body of 500 000 bad elements costs at most
// a pass over the list and a few issues, not one issue object per element (the schema's own array
// check would make them all). A good list is then parsed by the element schema as usual.
import { z } from 'zod';
import type { ErrorCode } from '../errors.js';

/** Most field issues one answer lists (the problem also gives the total). */
export const MAX_LISTED_ISSUES = 20;

export interface ListOptions {
  readonly min?: number;
  readonly max: number;
  /** A cheap test that an element is good (default: the element schema parses it); a bad element is then parsed for its message. */
  readonly good?: (element: unknown) => boolean;
  /** The error-table code of a list longer than max (default validation-failed): e.g. too-many-stations. */
  readonly tooMany?: ErrorCode;
}

export function boundedList<T extends z.ZodType>(element: T, options: ListOptions) {
  const { min = 0, max, good = (e: unknown) => element.safeParse(e).success, tooMany } = options;
  return z.preprocess((value, ctx) => {
    if (!Array.isArray(value)) return value; // the array schema reports the type
    if (value.length > max) {
      const message = `at most ${max} elements (got ${value.length})`;
      ctx.addIssue(tooMany ? { code: 'custom', message, params: { problem: tooMany }, input: undefined } : { code: 'too_big', origin: 'array', maximum: max, inclusive: true, input: value.length, message });
      return value;
    }
    let bad = 0;
    for (let i = 0; i < value.length && bad < MAX_LISTED_ISSUES; i++) {
      if (good(value[i])) continue;
      const parsed = element.safeParse(value[i]);
      if (parsed.success) continue;
      bad++;
      const first = parsed.error.issues[0]!;
      // A coded issue (codedIssue in common.ts) keeps its code.
      const params = first.code === 'custom' ? first.params : undefined;
      ctx.addIssue({ code: 'custom', path: [i, ...first.path.map((p) => (typeof p === 'symbol' ? String(p) : p))], message: first.message, input: undefined, ...(params ? { params } : {}) });
    }
    if (bad >= MAX_LISTED_ISSUES) ctx.addIssue({ code: 'custom', message: `the list has at least ${bad} bad elements; the first ${MAX_LISTED_ISSUES} are listed`, input: undefined });
    return value;
  }, z.array(element).min(min).max(max));
}
