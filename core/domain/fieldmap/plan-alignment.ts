/**
 * The map from one plan version's metres onto another's, composed from the alignments each version
 * stores to its previous one (x' = s·R(θ)·x + t). Comparing an earlier sweep with a later one on a
 * newer drawing walks the chain forward; the other way round inverts it.
 */
import { composeSimilarity, IDENTITY, invertSimilarity, type Similarity } from "../../analysis/geometry/similarity";

export interface PlanLink {
  id: string;
  previousPlanId: string | null;
  /** Maps the previous version's metres onto this one's; null = not set (taken as identity). */
  alignment: Similarity | null;
}

/** Earlier → later along the chain of previous versions; throws when the two are not on one chain. */
function forward(plans: ReadonlyMap<string, PlanLink>, earlierId: string, laterId: string): Similarity | null {
  // Collect later → … → earlier, then compose from the earlier end.
  const steps: Similarity[] = [];
  let at = plans.get(laterId);
  const seen = new Set<string>();
  while (at && at.id !== earlierId) {
    if (seen.has(at.id)) return null;
    seen.add(at.id);
    steps.push(at.alignment ?? IDENTITY);
    at = at.previousPlanId ? plans.get(at.previousPlanId) : undefined;
  }
  if (!at) return null;
  return steps.reverse().reduce((acc, s) => composeSimilarity(acc, s), IDENTITY);
}

export function alignmentBetween(plans: readonly PlanLink[], fromPlanId: string, toPlanId: string): Similarity {
  if (fromPlanId === toPlanId) return IDENTITY;
  const byId = new Map(plans.map((p) => [p.id, p]));
  const f = forward(byId, fromPlanId, toPlanId);
  if (f) return f;
  const b = forward(byId, toPlanId, fromPlanId);
  if (b) return invertSimilarity(b);
  throw new Error(`plans ${fromPlanId} and ${toPlanId} are not versions of one store's plan`);
}
