import { Router } from "express";
import { z } from "zod";
import type { AppContext } from "../../context";
import {
  chargeAdditionInput,
  chargeCorrectionInput,
  chargeVoidInput,
  chronicReportInput,
  leakCheckInput,
  leakDetectionCheckInput,
  acceptReadingInput,
  withdrawReadingInput,
} from "#core/contracts/compliance";
import { member, requireMember } from "../../middleware/auth";
import { validate } from "../../middleware/validate";
import {
  addCharge,
  addLeakCheck,
  addLeakDetectionCheck,
  correctCharge,
  fileChronicReport,
  getSystemRecords,
  voidCharge,
} from "./records.service";
import { acceptReading, listReadings, withdrawReading } from "./reading-acceptances";

const idParam = z.object({ id: z.uuid("must be a valid id") });

export function complianceRouter(ctx: AppContext): Router {
  const router = Router();

  /** The system records page: leak rate at every addition, threshold, due dates, CO2e, audit trail. */
  router.get("/systems/:id/records", requireMember("stores.read"), validate(idParam, "params"), async (req, res) => {
    res.json(await getSystemRecords(ctx, member(req), res.locals.params.id));
  });

  router.post(
    "/systems/:id/charge-additions",
    requireMember("findings.record"),
    validate(idParam, "params"),
    validate(chargeAdditionInput),
    async (req, res) => {
      res.status(201).json(await addCharge(ctx, member(req), req.auth!.user.id, res.locals.params.id, req.body));
    },
  );

  // Never an edit: a correction is a new entry that voids the old one.
  router.post(
    "/charge-additions/:id/corrections",
    requireMember("findings.record"),
    validate(idParam, "params"),
    validate(chargeCorrectionInput),
    async (req, res) => {
      res.status(201).json(await correctCharge(ctx, member(req), req.auth!.user.id, res.locals.params.id, req.body));
    },
  );

  router.post(
    "/charge-additions/:id/void",
    requireMember("findings.record"),
    validate(idParam, "params"),
    validate(chargeVoidInput),
    async (req, res) => {
      res.json(await voidCharge(ctx, member(req), req.auth!.user.id, res.locals.params.id, req.body.voidReason));
    },
  );

  router.post(
    "/systems/:id/leak-checks",
    requireMember("findings.record"),
    validate(idParam, "params"),
    validate(leakCheckInput),
    async (req, res) => {
      res.status(201).json(await addLeakCheck(ctx, member(req), req.auth!.user.id, res.locals.params.id, req.body));
    },
  );

  // The leak detection system's own check: a record of its own kind, audited (EU, decision 0123).
  router.post(
    "/systems/:id/leak-detection-checks",
    requireMember("findings.record"),
    validate(idParam, "params"),
    validate(leakDetectionCheckInput),
    async (req, res) => {
      res
        .status(201)
        .json(await addLeakDetectionCheck(ctx, member(req), req.auth!.user.id, res.locals.params.id, req.body));
    },
  );

  // Engineers and owners sign compliance filings.
  router.post(
    "/systems/:id/chronic-reports",
    requireMember("compliance.manage"),
    validate(idParam, "params"),
    validate(chronicReportInput),
    async (req, res) => {
      res
        .status(201)
        .json(await fileChronicReport(ctx, member(req), req.auth!.user.id, res.locals.params.id, req.body));
    },
  );

  // The rule-profile page's list of readings, linked from every "reading" marker.
  router.get("/compliance/readings", requireMember("stores.read"), async (req, res) => {
    res.json(await listReadings(ctx, member(req).companyId));
  });

  // The owner accepts a reading as worded (who and when, audited); changing one is a custom profile.
  router.post(
    "/compliance/readings/accept",
    requireMember("settings.manage"),
    validate(acceptReadingInput),
    async (req, res) => {
      res.json(await acceptReading(ctx, member(req), req.auth!.user.id, req.body));
    },
  );

  // The owner withdraws an acceptance, saying why; both stay in the history and on the audit trail.
  router.post(
    "/compliance/readings/withdraw",
    requireMember("settings.manage"),
    validate(withdrawReadingInput),
    async (req, res) => {
      res.json(await withdrawReading(ctx, member(req), req.auth!.user.id, req.body));
    },
  );

  return router;
}
