import { Router, type Request } from "express";
import { z } from "zod";
import type { AppContext } from "../../context";
import { logExport } from "../../lib/security-log";
import { sendReportInput } from "#core/contracts/reports";
import { member, requireMember } from "../../middleware/auth";
import { validate } from "../../middleware/validate";
import { readerUnits } from "./reader-units";
import {
  listReportSends,
  reportRecipients,
  retryReportSend,
  sendSweepReport,
  sweepReadingsCsv,
  sweepReportPdf,
} from "./reports.service";

const idParam = z.object({ id: z.uuid("must be a valid id") });

const sendParams = z.object({ id: z.uuid("must be a valid id"), sendId: z.uuid("must be a valid id") });

export function reportsRouter(ctx: AppContext): Router {
  const router = Router();
  const units = (req: Request) => readerUnits(ctx, req.auth!.user, member(req).companyId);

  router.get("/sweeps/:id/report.pdf", requireMember("stores.read"), validate(idParam, "params"), async (req, res) => {
    const { filename, pdf } = await sweepReportPdf(ctx, member(req), res.locals.params.id, await units(req));
    await logExport(ctx, req, "report.pdf", { sweepId: res.locals.params.id });
    res.type("application/pdf").setHeader("Content-Disposition", `attachment; filename="${filename}"`);
    res.send(pdf);
  });
  router.get(
    "/sweeps/:id/readings.csv",
    requireMember("sweeps.read"),
    validate(idParam, "params"),
    async (req, res) => {
      const { filename, csv } = await sweepReadingsCsv(ctx, member(req), res.locals.params.id, await units(req));
      await logExport(ctx, req, "readings.csv", { sweepId: res.locals.params.id });
      res.type("text/csv; charset=utf-8").setHeader("Content-Disposition", `attachment; filename="${filename}"`);
      res.send(csv);
    },
  );
  router.get(
    "/sweeps/:id/report/recipients",
    requireMember("reports.send"),
    validate(idParam, "params"),
    async (req, res) => {
      res.json({ storeContacts: await reportRecipients(ctx, member(req), res.locals.params.id) });
    },
  );
  router.get(
    "/sweeps/:id/report/sends",
    requireMember("sweeps.read"),
    validate(idParam, "params"),
    async (req, res) => {
      res.json({ sends: await listReportSends(ctx, member(req), res.locals.params.id) });
    },
  );
  router.post(
    "/sweeps/:id/report/send",
    requireMember("reports.send"),
    validate(idParam, "params"),
    validate(sendReportInput),
    async (req, res) => {
      res.status(201).json(await sendSweepReport(ctx, member(req), req.auth!.user.id, res.locals.params.id, req.body));
    },
  );
  router.post(
    "/sweeps/:id/report/sends/:sendId/retry",
    requireMember("reports.send"),
    validate(sendParams, "params"),
    async (req, res) => {
      res.json(await retryReportSend(ctx, member(req), res.locals.params.id, res.locals.params.sendId));
    },
  );
  return router;
}
