import { and, eq, inArray, type SQL } from "drizzle-orm";
import type { AppContext } from "../context";
import { stores } from "../db/schema/index";
import { isStoreScoped, type Role } from "#core/domain/roles";
import { notFound } from "../lib/http-error";

/** Who is asking: the active membership (company, role and, for store contacts, their stores). */
export interface Viewer {
  companyId: string;
  role: Role;
  storeIds: string[];
}

/** The company's stores this viewer may see, as a where-clause (store contacts: only theirs). */
export function visibleStores(viewer: Viewer): SQL {
  const inCompany = eq(stores.companyId, viewer.companyId);
  if (!isStoreScoped(viewer.role)) return inCompany;
  // An empty scope matches nothing (inArray with [] is not valid SQL).
  return and(
    inCompany,
    viewer.storeIds.length
      ? inArray(stores.id, viewer.storeIds)
      : eq(stores.id, "00000000-0000-0000-0000-000000000000"),
  )!;
}

/**
 * The store row when this viewer may see it; otherwise 404 — never 403, so ids of other
 * companies' stores (or of stores outside a contact's scope) reveal nothing.
 */
export async function loadVisibleStore(ctx: AppContext, viewer: Viewer, storeId: string) {
  const [row] = await ctx.db
    .select()
    .from(stores)
    .where(and(eq(stores.id, storeId), visibleStores(viewer)));
  if (!row) throw notFound("That store");
  return row;
}
