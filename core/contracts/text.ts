import { z } from "zod";

// Every text field of every contract is made here, so no character PostgreSQL cannot store reaches it:
// a NUL is refused by text columns (a 500 that refused a whole batch), and a lone UTF-16 surrogate is
// stored as "\uFFFD" in text and refused in jsonb. Both are refused at the field, with this reason.

export const NUL_REASON = "must not contain a NUL character (\\u0000)";
export const SURROGATE_REASON = "must not contain a broken character (a lone UTF-16 surrogate)";

// Matched per UTF-16 code unit (no `u` flag): a high surrogate not followed by a low one, or a low
// surrogate not preceded by a high one.
const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

export function hasNul(s: string): boolean {
  return s.includes("\u0000");
}

export function hasLoneSurrogate(s: string): boolean {
  return LONE_SURROGATE.test(s);
}

/** A string schema that refuses NUL and lone surrogates; use it instead of `z.string()` in contracts. */
export function text(params?: Parameters<typeof z.string>[0]) {
  return z
    .string(params)
    .refine((s) => !hasNul(s), NUL_REASON)
    .refine((s) => !hasLoneSurrogate(s), SURROGATE_REASON);
}
