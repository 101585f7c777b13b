import type { IncomingMessage } from "node:http";
import { HttpError } from "../lib/http-error";

/** Deeper than any contract nests (about six levels); JSON.parse overflows its stack near ten thousand. */
export const MAX_JSON_DEPTH = 64;

/** How deep a JSON text nests, counted over its bytes without parsing (brackets inside strings do not count). */
export function jsonDepth(buf: Buffer, stopAt = Number.POSITIVE_INFINITY): number {
  let depth = 0;
  let deepest = 0;
  let inString = false;
  for (let i = 0; i < buf.length; i++) {
    const c = buf[i];
    if (inString) {
      if (c === 0x5c)
        i++; // backslash: skip the escaped byte
      else if (c === 0x22) inString = false;
    } else if (c === 0x22) inString = true;
    else if (c === 0x5b || c === 0x7b) {
      if (++depth > deepest) deepest = depth;
      if (deepest > stopAt) return deepest;
    } else if (c === 0x5d || c === 0x7d) depth--;
  }
  return deepest;
}

/** express.json's `verify`: refuses bodies nested deeper than MAX_JSON_DEPTH before they are parsed. */
export function refuseDeepJson(_req: IncomingMessage, _res: unknown, buf: Buffer): void {
  if (jsonDepth(buf, MAX_JSON_DEPTH) > MAX_JSON_DEPTH)
    throw new HttpError(400, "too_deep", `The request body nests deeper than ${MAX_JSON_DEPTH} levels.`);
}
