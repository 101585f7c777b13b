import type { SweepPass } from "#core/contracts/sweeps";

/**
 * Each analysed reading with the pass it was taken in (1 for the first pass; pinpoint passes by their
 * number), from the stored readings' pass ids. Readings the stored list lacks stay in the first pass.
 */
export function withPasses<R extends { readingId: string }>(
  analysed: readonly R[],
  stored: readonly { id: string; passId: string | null }[] | undefined,
  passes: readonly Pick<SweepPass, "id" | "number">[],
): (R & { pass: number })[] {
  const numberOf = new Map(passes.map((p) => [p.id, p.number]));
  const passOf = new Map((stored ?? []).map((r) => [r.id, r.passId ? (numberOf.get(r.passId) ?? 1) : 1]));
  return analysed.map((r) => ({ ...r, pass: passOf.get(r.readingId) ?? 1 }));
}
