import { Router } from "express";
import { desc, eq } from "drizzle-orm";
import type { AppContext } from "../../context";
import { outboxMessages } from "../../db/schema/index";
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

  return router;
}
