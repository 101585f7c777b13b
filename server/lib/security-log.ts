import type { Request } from "express";
import type { AppContext } from "../context";
import type { SecurityEventKind } from "#core/contracts/security-log";
import { securityEvents } from "../db/schema/index";

export interface SecurityEventInput {
  kind: SecurityEventKind;
  /** Null for events about a person's account (shown to the owners of each of their companies). */
  companyId: string | null;
  userId: string;
  actorId?: string | null;
  detail?: Record<string, string | number | null>;
}

/** Writes one event of the security log (docs/decisions/0028-security-log.md). */
export async function logSecurityEvent(ctx: AppContext, req: Request | null, e: SecurityEventInput): Promise<void> {
  await ctx.db.insert(securityEvents).values({
    kind: e.kind,
    companyId: e.companyId,
    userId: e.userId,
    actorId: e.actorId ?? null,
    detail: e.detail ?? {},
    ip: req?.ip ?? null,
  });
}

/** An export (CSV or PDF) by the signed-in member, logged under their company. */
export async function logExport(
  ctx: AppContext,
  req: Request,
  what: string,
  ids: Record<string, string>,
): Promise<void> {
  const m = req.auth?.membership;
  if (!m || !req.auth) return;
  await logSecurityEvent(ctx, req, {
    kind: "export",
    companyId: m.companyId,
    userId: req.auth.user.id,
    detail: { what, ...ids },
  });
}
