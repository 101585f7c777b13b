import { and, asc, desc, eq, ilike, isNull, or, sql } from "drizzle-orm";
import type { AppContext } from "../../context";
import type { Store, StoreInput, StoreListQuery, StoreUpdateInput } from "#core/contracts/stores";
import { stores } from "../../db/schema/index";
import { loadVisibleStore, visibleStores, type Viewer } from "../../access/store-access";

type StoreRow = typeof stores.$inferSelect;

export function toStore(s: StoreRow): Store {
  return {
    id: s.id,
    name: s.name,
    address: s.address,
    timeZone: s.timeZone,
    archivedAt: s.archivedAt?.toISOString() ?? null,
    createdAt: s.createdAt.toISOString(),
    updatedAt: s.updatedAt.toISOString(),
  };
}

/** `%` and `_` typed into the search box are literal characters, not LIKE wildcards. */
function likePattern(text: string): string {
  return `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}

export async function listStores(ctx: AppContext, viewer: Viewer, q: StoreListQuery): Promise<Store[]> {
  const search = q.search
    ? or(ilike(stores.name, likePattern(q.search)), ilike(stores.address, likePattern(q.search)))
    : undefined;
  const dir = q.order === "desc" ? desc : asc;
  // Names sort case-insensitively, then by id so equal names keep a stable order.
  const order =
    q.sort === "created" ? [dir(stores.createdAt), asc(stores.id)] : [dir(sql`lower(${stores.name})`), asc(stores.id)];
  const rows = await ctx.db
    .select()
    .from(stores)
    .where(and(visibleStores(viewer), q.includeArchived ? undefined : isNull(stores.archivedAt), search))
    .orderBy(...order);
  return rows.map(toStore);
}

export async function createStore(ctx: AppContext, companyId: string, input: StoreInput): Promise<Store> {
  const [row] = await ctx.db
    .insert(stores)
    .values({ companyId, ...input })
    .returning();
  return toStore(row);
}

export async function updateStore(
  ctx: AppContext,
  viewer: Viewer,
  storeId: string,
  input: StoreUpdateInput,
): Promise<Store> {
  await loadVisibleStore(ctx, viewer, storeId);
  const [row] = await ctx.db
    .update(stores)
    .set({ ...input, updatedAt: new Date() })
    .where(eq(stores.id, storeId))
    .returning();
  return toStore(row);
}

/** Archiving hides a store from the default list; nothing of it is deleted. */
export async function setArchived(ctx: AppContext, viewer: Viewer, storeId: string, archived: boolean): Promise<Store> {
  const current = await loadVisibleStore(ctx, viewer, storeId);
  if (Boolean(current.archivedAt) === archived) return toStore(current);
  const [row] = await ctx.db
    .update(stores)
    .set({ archivedAt: archived ? new Date() : null, updatedAt: new Date() })
    .where(eq(stores.id, storeId))
    .returning();
  return toStore(row);
}
