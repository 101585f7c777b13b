/** A path into a rule-profile draft, e.g. ["leakRateParts", 1, "repairDays"]. */
export type DraftPath = readonly (string | number)[];

export const pathKey = (path: DraftPath) => path.map(String).join(".");

export function getAt(node: unknown, path: DraftPath): unknown {
  return path.reduce<unknown>((n, k) => (n !== null && typeof n === "object" ? (n as Record<string, unknown>)[k as string] : undefined), node);
}

/** A copy of the draft with one value replaced; the original is left as it was. */
export function setAt<T>(draft: T, path: DraftPath, value: unknown): T {
  if (path.length === 0) return value as T;
  const [head, ...rest] = path;
  const copy = (Array.isArray(draft) ? [...draft] : { ...(draft as object) }) as Record<string, unknown>;
  copy[head as string] = setAt(copy[head as string], rest, value);
  return copy as T;
}

/**
 * What a number box holds, for the draft: a number when the text is one, otherwise the text itself,
 * so the shared schema refuses it with the field named ("must be a number") instead of guessing.
 */
export function numberFromText(text: string): number | string {
  const t = text.trim().replace(",", ".");
  return t !== "" && Number.isFinite(Number(t)) ? Number(t) : text;
}
