/** A path into a rule-profile draft, e.g. ["leakRateParts", 1, "repairDays"]. */
export type DraftPath = readonly (string | number)[];

export const pathKey = (path: DraftPath) => path.map(String).join(".");

export function getAt(node: unknown, path: DraftPath): unknown {
  return path.reduce<unknown>(
    (n, k) => (n !== null && typeof n === "object" ? (n as Record<string, unknown>)[k as string] : undefined),
    node,
  );
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

interface Band {
  from: number;
  to: number | null;
  monthsWithoutLds: number;
  monthsWithLds: number;
  ldsRequired: boolean;
}

/**
 * A new open top band: the old top band now ends at ten times its lower edge (a starting point to
 * edit), and the new one starts there with the same intervals, so the bands still ascend.
 */
export function addTopBand<B extends Band>(bands: readonly B[]): B[] {
  const top = bands.at(-1);
  if (!top) return [{ from: 5, to: null, monthsWithoutLds: 12, monthsWithLds: 24, ldsRequired: false } as B];
  const edge = Number.isFinite(top.from) && top.from > 0 ? top.from * 10 : 10;
  return [...bands.slice(0, -1), { ...top, to: edge }, { ...top, from: edge, to: null }];
}

/** Drops the top band; the one below becomes the open top band. */
export function removeTopBand<B extends Band>(bands: readonly B[]): B[] {
  if (bands.length < 2) return [...bands];
  const rest = bands.slice(0, -1);
  return [...rest.slice(0, -1), { ...rest.at(-1)!, to: null }];
}
