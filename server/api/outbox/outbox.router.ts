import { Router } from "express";
import { and, desc, eq, ne } from "drizzle-orm";
import type { AppContext } from "../../context";
import { outboxMessages, outgoingMail } from "../../db/schema/index";
import { HttpError } from "../../lib/http-error";
import { member, requireMember } from "../../middleware/auth";

export function outboxRouter(ctx: AppContext): Router {
  const router = Router();

  router.get("/outbox", requireMember("outbox.read"), async (req, res) => {
    if (!ctx.config.outboxEnabled)
      throw new HttpError(404, "not_found", "The Outbox exists only while mail goes to the built-in test mail server.");
    const companyId = member(req).companyId;
    // A company sees only its own mail. Mail for no company (password resets) is never listed: it would
    // hand one company's members another's reset links. Its links go to the server log instead.
    const rows = await ctx.db
      .select()
      .from(outboxMessages)
      .where(eq(outboxMessages.companyId, companyId))
      .orderBy(desc(outboxMessages.receivedAt))
      .limit(200);
    res.json({
      messages: rows.map((m) => ({
        id: m.id,
        from: m.from,
        to: m.to,
        subject: m.subject,
        text: m.text,
        html: m.html,
        attachments: m.attachments,
        receivedAt: m.receivedAt.toISOString(),
      })),
    });
  });

  // The company's mail not yet delivered (a report's PDF being made, queued, or failed), newest first:
  // what the Outbox has not caught yet, and why. Password resets are never listed (as above).
  router.get("/outbox/on-its-way", requireMember("outbox.read"), async (req, res) => {
    if (!ctx.config.outboxEnabled)
      throw new HttpError(404, "not_found", "The Outbox exists only while mail goes to the built-in test mail server.");
    const rows = await ctx.db
      .select()
      .from(outgoingMail)
      .where(
        and(
          eq(outgoingMail.companyId, member(req).companyId),
          ne(outgoingMail.state, "sent"),
          ne(outgoingMail.kind, "password-reset"),
        ),
      )
      .orderBy(desc(outgoingMail.createdAt))
      .limit(100);
    res.json({
      messages: rows.map((m) => ({
        id: m.id,
        kind: m.kind,
        to: m.to,
        subject: m.subject,
        state: m.state,
        attempts: m.attempts,
        error: m.lastError,
        queuedAt: m.createdAt.toISOString(),
      })),
    });
  });

  return router;
}
