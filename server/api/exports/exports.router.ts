import { Router } from "express";
import { z } from "zod";
import type { AppContext } from "../../context";
import { logExport } from "../../lib/security-log";
import { member, requireMember } from "../../middleware/auth";
import { validate } from "../../middleware/validate";
import { getSystemRecords } from "../compliance/records.service";
import { listFindings } from "../findings/findings.service";
import { listRevisions } from "../systems/system-revisions.service";
import { readerUnits } from "../reports/reader-units";
import { loadArchive, writeArchive } from "./company-archive";
import { leakRateStatementPdf } from "./leak-rate-statement";
import { recordsCsv } from "./records-csv";
import { statementSettings } from "./statement-settings";

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
      const { rules, statement } = await statementSettings(ctx, member(req).companyId);
      const records = await getSystemRecords(ctx, member(req), res.locals.params.id, new Date(), rules);
      const list = await listFindings(ctx, member(req), records.store.id, { systemId: records.system.id });
      const revisions = await listRevisions(ctx, member(req), records.system.id);
      res.set({
        "Content-Type": "text/csv; charset=utf-8",
        "Content-Disposition": `attachment; filename="${fileName(records.system.name, "csv")}"`,
      });
      await logExport(ctx, req, "records.csv", { systemId: records.system.id });
      res.send(recordsCsv(records, list, statement.massUnit, revisions));
    },
  );

  router.get(
    "/systems/:id/leak-rate-statement.pdf",
    requireMember("stores.read"),
    validate(idParam, "params"),
    async (req, res) => {
      // The company row is read once for the rules, the unit, the number format and the paper.
      const { rules, statement } = await statementSettings(ctx, member(req).companyId);
      const records = await getSystemRecords(ctx, member(req), res.locals.params.id, new Date(), rules);
      const list = await listFindings(ctx, member(req), records.store.id, { systemId: records.system.id });
      const revisions = await listRevisions(ctx, member(req), records.system.id);
      const pdf = await leakRateStatementPdf(records, list, statement, revisions);
      await logExport(ctx, req, "leak-rate-statement.pdf", { systemId: records.system.id });
      res.set({
        "Content-Type": "application/pdf",
        "Content-Disposition": `inline; filename="${fileName(records.system.name, "pdf")}"`,
      });
      res.send(pdf);
    },
  );

  // The owner's whole record set (docs/decisions/0046-owners-record-archive.md). Tables are read
  // before the headers go out; the PDFs are made while the zip streams.
  router.get("/company/records-archive.zip", requireMember("records.export"), async (req, res) => {
    const viewer = member(req);
    const loaded = await loadArchive(ctx, viewer);
    const units = await readerUnits(ctx, req.auth!.user, viewer.companyId);
    const day = new Date().toISOString().slice(0, 10);
    await logExport(ctx, req, "records-archive.zip", { companyId: viewer.companyId });
    res.set({
      "Content-Type": "application/zip",
      "Content-Disposition": `attachment; filename="plumeline-records-${day}.zip"`,
    });
    try {
      await writeArchive(ctx, viewer, loaded, units, res);
    } catch (err) {
      // The headers are gone, so no JSON error can follow: end the stream so the download fails visibly.
      req.log?.error({ err }, "records archive stopped");
      res.destroy(err instanceof Error ? err : undefined);
    }
  });

  return router;
}
