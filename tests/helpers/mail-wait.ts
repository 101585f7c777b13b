import { and, arrayContains, desc, gt } from "drizzle-orm";
import type { AppContext } from "../../server/context";
import { outboxMessages } from "../../server/db/schema/index";

/**
 * The newest message to `to` caught after `since`. Some mail is queued only after the answer (so
 * known and unknown addresses answer alike): poll briefly, delivering what the queue holds each time.
 */
export async function waitForMail(ctx: Pick<AppContext, "db" | "mailer">, to: string, since: Date, timeoutMs = 20_000) {
  const until = Date.now() + timeoutMs;
  for (;;) {
    await ctx.mailer.drain();
    const [mail] = await ctx.db
      .select()
      .from(outboxMessages)
      .where(and(arrayContains(outboxMessages.to, [to]), gt(outboxMessages.receivedAt, since)))
      .orderBy(desc(outboxMessages.receivedAt))
      .limit(1);
    if (mail) return mail;
    if (Date.now() > until) throw new Error(`no mail to ${to} within ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 50));
  }
}

export function resetTokenIn(text: string): string {
  const token = text.match(/reset-password\/([A-Za-z0-9_-]+)/)?.[1];
  if (!token) throw new Error("no reset link in the mail");
  return token;
}
