import { Router } from "express";
import { z } from "zod";
import { eq } from "drizzle-orm";
import type { AppContext } from "../../context";
import { logExport } from "../../lib/security-log";
import { member, requireMember } from "../../middleware/auth";
import { validate } from "../../middleware/validate";
import { getSystemRecords } from "../compliance/records.service";
import { listFindings } from "../findings/findings.service";
import { companyRules } from "../compliance/system-records";
import { companyPaper } from "../../reports/company-paper";
import { companies } from "../../db/schema/index";
import { leakRateStatementPdf } from "./leak-rate-statement";
import { recordsCsv } from "./records-csv";

const idParam = z.object({ id: z.uuid("must be a valid id") });
const fileName = (name: string, ext: string) =>
  `${
    name
      .replace(/[^A-Za-z0-9]+/g, "-")
      .replace(/^-|-$/g, "")
      .toLowerCase() || "system"
  }-records.${ext}`;

export function exportsRouter(ctx: AppContext): Router {
  const router = Router();

  router.get(
    "/systems/:id/records.csv",
    requireMember("stores.read"),
    validate(idParam, "params"),
    async (req, res) => {
      const records = await getSystemRecords(ctx, member(req), res.locals.params.id);
      const list = await listFindings(ctx, member(req), records.store.id, { systemId: records.system.id });
      res.set({
        "Content-Type": "text/csv; charset=utf-8",
        "Content-Disposition": `attachment; filename="${fileName(records.system.name, "csv")}"`,
      });
      await logExport(ctx, req, "records.csv", { systemId: records.system.id });
      res.send(recordsCsv(records, list));
    },
  );

  router.get(
    "/systems/:id/leak-rate-statement.pdf",
    requireMember("stores.read"),
    validate(idParam, "params"),
    async (req, res) => {
      const records = await getSystemRecords(ctx, member(req), res.locals.params.id);
      const list = await listFindings(ctx, member(req), records.store.id, { systemId: records.system.id });
      const companyId = member(req).companyId;
      const [{ profile }, [company]] = await Promise.all([
        companyRules(ctx, companyId),
        ctx.db.select({ massUnit: companies.massUnit }).from(companies).where(eq(companies.id, companyId)),
      ]);
      const pdf = await leakRateStatementPdf(records, list, {
        paper: await companyPaper(ctx, companyId, profile),
        massUnit: company?.massUnit ?? "kg",
      });
      await logExport(ctx, req, "leak-rate-statement.pdf", { systemId: records.system.id });
      res.set({
        "Content-Type": "application/pdf",
        "Content-Disposition": `inline; filename="${fileName(records.system.name, "pdf")}"`,
      });
      res.send(pdf);
    },
  );

  return router;
}
