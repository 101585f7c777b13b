import { and, eq } from "drizzle-orm";
import type { AppContext } from "../../context";
import { companyRefrigerants } from "../../db/schema/index";
import type { Tx } from "../../db/tx";
import { badRequest } from "../../lib/http-error";
import {
  companyRefrigerantRowId,
  refrigerantLookup,
  toCompanyRefrigerant,
  type CompanyRefrigerantRow,
} from "#core/domain/refrigerants/company-refrigerant";
import type {
  CompanyRefrigerant,
  GwpBasis,
  Refrigerant,
  SafetyClass,
  SubstanceClass,
} from "#core/domain/refrigerants/types";

export type RefrigerantRow = typeof companyRefrigerants.$inferSelect;

/** The checked facts of a stored row (the columns hold only what the service checked on the way in). */
export function rowFacts(row: RefrigerantRow): CompanyRefrigerantRow {
  return {
    id: row.id,
    name: row.name,
    safetyClass: row.safetyClass as SafetyClass,
    substanceClass: row.substanceClass as SubstanceClass,
    components: row.components ?? null,
    statedGwp:
      row.statedGwp !== null && row.statedGwpBasis !== null
        ? { value: row.statedGwp, basis: row.statedGwpBasis as GwpBasis, source: row.statedGwpSource ?? "" }
        : null,
    molarMass: row.molarMass,
    retired: row.retiredAt !== null,
  };
}

/** Every refrigerant the company entered, retired ones too: records keep naming them. */
export async function companyRefrigerantsOf(ctx: AppContext, companyId: string): Promise<CompanyRefrigerant[]> {
  const rows = await ctx.db.select().from(companyRefrigerants).where(eq(companyRefrigerants.companyId, companyId));
  return rows.map((r) => toCompanyRefrigerant(rowFacts(r)));
}

export type RefrigerantLookup = (id: string) => Refrigerant | undefined;

/** Catalogue first, then the company's own; another company's refrigerant is never found. */
export async function lookupFor(ctx: AppContext, companyId: string): Promise<RefrigerantLookup> {
  return refrigerantLookup(await companyRefrigerantsOf(ctx, companyId));
}

/** For figures over rows already checked on write: a missing refrigerant is a bug, not bad input. */
export function resolveStored(lookup: RefrigerantLookup, id: string): Refrigerant {
  const r = lookup(id);
  if (!r) throw new Error(`refrigerant ${id} is neither in the catalogue nor among the company's own`);
  return r;
}

/**
 * Inside the transaction that saves a system naming a company refrigerant: holds its row so a
 * delete running at the same time waits and then counts this system (or this save finds it gone).
 */
export async function holdRefrigerant(tx: Tx, companyId: string, key: string): Promise<void> {
  const rowId = companyRefrigerantRowId(key);
  if (rowId === null) return;
  const [row] = await tx
    .select({ id: companyRefrigerants.id })
    .from(companyRefrigerants)
    .where(and(eq(companyRefrigerants.id, rowId), eq(companyRefrigerants.companyId, companyId)))
    .for("share");
  if (!row)
    throw badRequest("Please check: that refrigerant was deleted meanwhile.", {
      refrigerantId: "was deleted meanwhile: pick another",
    });
}
