import { Router } from "express";
import { alias } from "drizzle-orm/pg-core";
import { and, desc, eq, inArray, isNull, or } from "drizzle-orm";
import type { AppContext } from "../../context";
import { memberships, securityEvents, users } from "../../db/schema/index";
import { member, requireMember } from "../../middleware/auth";

const LOG_PAGE = 200;

/** The owner reads the company's security log: its own events and account events of its members. */
export function securityLogRouter(ctx: AppContext): Router {
  const router = Router();
  router.get("/company/security-log", requireMember("members.manage"), async (req, res) => {
    const companyId = member(req).companyId;
    const who = alias(users, "who");
    const by = alias(users, "by");
    const members = ctx.db
      .select({ id: memberships.userId })
      .from(memberships)
      .where(eq(memberships.companyId, companyId));
    const rows = await ctx.db
      .select({ e: securityEvents, who: who.email, by: by.email })
      .from(securityEvents)
      .leftJoin(who, eq(who.id, securityEvents.userId))
      .leftJoin(by, eq(by.id, securityEvents.actorId))
      .where(
        or(
          eq(securityEvents.companyId, companyId),
          and(isNull(securityEvents.companyId), inArray(securityEvents.userId, members)),
        ),
      )
      .orderBy(desc(securityEvents.at))
      .limit(LOG_PAGE);
    res.json({
      events: rows.map((r) => ({
        id: r.e.id,
        kind: r.e.kind,
        who: r.who,
        by: r.by,
        detail: r.e.detail,
        ip: r.e.ip,
        at: r.e.at.toISOString(),
      })),
    });
  });
  return router;
}
