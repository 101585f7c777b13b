import { and, eq, inArray, or, sql } from "drizzle-orm";
import type { AppContext } from "../../context";
import type { CompanyRefrigerantInput, CompanyRefrigerantView } from "#core/contracts/company-refrigerants";
import {
  checkCompanyRefrigerant,
  companyRefrigerantKey,
  toCompanyRefrigerant,
} from "#core/domain/refrigerants/company-refrigerant";
import { summarizeRefrigerant } from "#core/domain/refrigerants/refrigerant-summary";
import { DomainInputError } from "#core/domain/input-error";
import { formatAsGiven, type NumberFormat } from "#core/domain/numbers/number-format";
import {
  companies,
  companyRefrigerants,
  complianceAudit,
  systemRevisions,
  systems,
  users,
} from "../../db/schema/index";
import { badRequest, conflict, notFound } from "../../lib/http-error";
import { companyGwpBases } from "../systems/systems.service";
import { rulesOfSettings, type CompanyRules } from "../compliance/system-records";
import type { DbOrTx } from "../../db/tx";
import { rowFacts, type RefrigerantRow } from "./company-refrigerant-lookup";

/** Case and spaces do not make a second refrigerant: "House Blend 1" and "houseblend1" are one name. */
export function nameKeyOf(name: string): string {
  return name.toLowerCase().replace(/\s+/g, "");
}

/** How many systems name each key, now or in any revision (their records name it). */
async function usage(db: DbOrTx, companyId: string, keys: string[]): Promise<Map<string, number>> {
  if (keys.length === 0) return new Map();
  const rows = await db
    .selectDistinct({ systemId: systems.id, key: systemRevisions.refrigerantId, now: systems.refrigerantId })
    .from(systems)
    .leftJoin(systemRevisions, eq(systemRevisions.systemId, systems.id))
    .where(
      and(
        eq(systems.companyId, companyId),
        or(inArray(systems.refrigerantId, keys), inArray(systemRevisions.refrigerantId, keys)),
      ),
    );
  const seen = new Map<string, Set<string>>();
  for (const r of rows)
    for (const k of [r.key, r.now]) if (k && keys.includes(k)) seen.set(k, (seen.get(k) ?? new Set()).add(r.systemId));
  return new Map([...seen].map(([k, s]) => [k, s.size]));
}

async function views(
  ctx: AppContext,
  companyId: string,
  rows: RefrigerantRow[],
  rules?: CompanyRules,
): Promise<CompanyRefrigerantView[]> {
  const choice = await companyGwpBases(ctx, companyId, rules);
  const used = await usage(
    ctx.db,
    companyId,
    rows.map((r) => companyRefrigerantKey(r.id)),
  );
  const names = new Map(
    (
      await ctx.db
        .select({ id: users.id, name: users.name })
        .from(users)
        .where(
          inArray(
            users.id,
            rows.map((r) => r.enteredById),
          ),
        )
    ).map((u) => [u.id, u.name]),
  );
  return rows.map((row) => {
    const facts = rowFacts(row);
    return {
      rowId: row.id,
      summary: summarizeRefrigerant(toCompanyRefrigerant(facts), choice),
      safetyClass: facts.safetyClass,
      substanceClass: facts.substanceClass,
      composition: facts.components?.map((c) => ({ refrigerantId: c.id, massPercent: c.massPercent })) ?? null,
      statedGwp: facts.statedGwp,
      molarMass: facts.molarMass,
      systemsUsing: used.get(companyRefrigerantKey(row.id)) ?? 0,
      retired: facts.retired,
      enteredBy: names.get(row.enteredById) ?? "",
      enteredAt: row.enteredAt.toISOString(),
    };
  });
}

export async function listCompanyRefrigerants(ctx: AppContext, companyId: string): Promise<CompanyRefrigerantView[]> {
  const rows = await ctx.db
    .select()
    .from(companyRefrigerants)
    .where(eq(companyRefrigerants.companyId, companyId))
    .orderBy(sql`${companyRefrigerants.retiredAt} is not null`, companyRefrigerants.nameKey);
  return views(ctx, companyId, rows);
}

async function loadOwn(ctx: AppContext, companyId: string, rowId: string): Promise<RefrigerantRow> {
  const [row] = await ctx.db
    .select()
    .from(companyRefrigerants)
    .where(and(eq(companyRefrigerants.id, rowId), eq(companyRefrigerants.companyId, companyId)));
  if (!row) throw notFound("That refrigerant");
  return row;
}

const NAME_TAKEN = "is already the name of one of the company's refrigerants";

export async function createCompanyRefrigerant(
  ctx: AppContext,
  companyId: string,
  userId: string,
  input: CompanyRefrigerantInput,
): Promise<CompanyRefrigerantView> {
  let checked: ReturnType<typeof checkCompanyRefrigerant>;
  try {
    checked = checkCompanyRefrigerant({ ...input, molarMass: input.molarMass ?? null });
  } catch (err) {
    if (!(err instanceof DomainInputError)) throw err;
    throw badRequest(`Please check: ${err.field} ${err.reason}.`, { [err.field]: err.reason });
  }
  const nameKey = nameKeyOf(checked.name);
  const [taken] = await ctx.db
    .select({ id: companyRefrigerants.id })
    .from(companyRefrigerants)
    .where(and(eq(companyRefrigerants.companyId, companyId), eq(companyRefrigerants.nameKey, nameKey)));
  if (taken) throw badRequest(`Please check: name ${NAME_TAKEN}.`, { name: NAME_TAKEN });
  // One read of the company's row: its number format for the audit's words, its rules for the view.
  const [company] = await ctx.db
    .select({ ruleProfile: companies.ruleProfile, method: companies.leakRateMethod, number: companies.numberFormat })
    .from(companies)
    .where(eq(companies.id, companyId));
  const format = company?.number ?? "1,234.5";
  const rules = await rulesOfSettings(ctx, companyId, company);
  const row = await ctx.db.transaction(async (tx) => {
    const [created] = await tx
      .insert(companyRefrigerants)
      .values({
        companyId,
        name: checked.name,
        nameKey,
        safetyClass: checked.safetyClass,
        substanceClass: checked.substanceClass,
        components: checked.components,
        statedGwp: checked.statedGwp?.value ?? null,
        statedGwpBasis: checked.statedGwp?.basis ?? null,
        statedGwpSource: checked.statedGwp?.source ?? null,
        molarMass: checked.molarMass,
        enteredById: userId,
      })
      .onConflictDoNothing()
      .returning();
    if (!created) return null;
    await tx.insert(complianceAudit).values({
      companyId,
      systemId: null,
      action: "refrigerant-entered",
      byId: userId,
      summary: `Refrigerant entered by the company: ${describe(checked, format)}`,
    });
    return created;
  });
  // Two people saving the same name at once: the second is told, not given a 500.
  if (!row) throw badRequest(`Please check: name ${NAME_TAKEN}.`, { name: NAME_TAKEN });
  return (await views(ctx, companyId, [row], rules))[0];
}

/** The audit's words for a refrigerant the company entered, its figures in the company's number format. */
function describe(c: ReturnType<typeof checkCompanyRefrigerant>, format: NumberFormat): string {
  const what = c.components
    ? c.components.map((k) => `${k.id} ${formatAsGiven(k.massPercent, format)} %`).join(", ")
    : `GWP ${formatAsGiven(c.statedGwp!.value, format)} (${c.statedGwp!.basis}; ${c.statedGwp!.source})`;
  return `${c.name}, ${c.safetyClass}, ${what}`;
}

/** Retiring hides it from the picker; systems that use it keep it, and so do their records. */
export async function setCompanyRefrigerantRetired(
  ctx: AppContext,
  companyId: string,
  userId: string,
  rowId: string,
  retired: boolean,
): Promise<CompanyRefrigerantView> {
  const row = await loadOwn(ctx, companyId, rowId);
  if ((row.retiredAt !== null) === retired) return (await views(ctx, companyId, [row]))[0];
  const updated = await ctx.db.transaction(async (tx) => {
    const [u] = await tx
      .update(companyRefrigerants)
      .set({ retiredAt: retired ? new Date() : null })
      .where(eq(companyRefrigerants.id, rowId))
      .returning();
    await tx.insert(complianceAudit).values({
      companyId,
      systemId: null,
      action: retired ? "refrigerant-retired" : "refrigerant-restored",
      byId: userId,
      summary: `${retired ? "Retired" : "Brought back"}: the company's refrigerant ${row.name}`,
    });
    return u;
  });
  return (await views(ctx, companyId, [updated]))[0];
}

/** Deleted only while no system names it, now or in its history; otherwise it is retired instead. */
export async function deleteCompanyRefrigerant(
  ctx: AppContext,
  companyId: string,
  userId: string,
  rowId: string,
): Promise<void> {
  const row = await loadOwn(ctx, companyId, rowId);
  const key = companyRefrigerantKey(row.id);
  await ctx.db.transaction(async (tx) => {
    // Locked first, counted after: a system saved meanwhile holds the row (holdRefrigerant) and is counted.
    await tx
      .select({ id: companyRefrigerants.id })
      .from(companyRefrigerants)
      .where(eq(companyRefrigerants.id, rowId))
      .for("update");
    const count = (await usage(tx, companyId, [key])).get(key) ?? 0;
    if (count > 0)
      throw conflict(
        `${row.name} is the refrigerant of ${count} system${count === 1 ? "" : "s"} and stays in their records: retire it instead.`,
      );
    await tx.delete(companyRefrigerants).where(eq(companyRefrigerants.id, rowId));
    await tx.insert(complianceAudit).values({
      companyId,
      systemId: null,
      action: "refrigerant-deleted",
      byId: userId,
      summary: `Deleted before any system used it: the company's refrigerant ${row.name}`,
    });
  });
}
