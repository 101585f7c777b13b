import { and, eq, gt, isNull } from "drizzle-orm";
import type { AppContext } from "../../context";
import type { SignUpInput } from "#core/contracts/signup";
import { companies, companySignups, memberships, users } from "../../db/schema/index";
import { HttpError } from "../../lib/http-error";
import { hashToken, newLinkToken } from "../../lib/tokens";
import { signUpConfirmMail, signUpExistingAccountMail } from "../../mail/templates";
import { hashPassword } from "../auth/auth.service";

const CONFIRM_VALID_MS = 24 * 60 * 60 * 1000;

/**
 * Records a sign-up and mails the confirmation link. Answers the same way for an address that
 * already has an account (that person gets a "sign in instead" mail), so the form reveals nothing.
 */
export async function requestSignUp(ctx: AppContext, input: Required<SignUpInput>): Promise<void> {
  const passwordHash = await hashPassword(ctx, input.password); // on both paths: the same time either way
  const [existing] = await ctx.db.select({ id: users.id }).from(users).where(eq(users.email, input.email));
  let mail: { subject: string; text: string };
  if (existing) {
    mail = signUpExistingAccountMail({ name: input.name, signInLink: `${ctx.config.appUrl}/sign-in` });
  } else {
    const { token, hash } = newLinkToken();
    await ctx.db.insert(companySignups).values({
      companyName: input.companyName,
      name: input.name,
      email: input.email,
      passwordHash,
      ruleProfile: input.ruleProfile,
      lengthUnit: input.lengthUnit,
      massUnit: input.massUnit,
      numberFormat: input.numberFormat,
      tokenHash: hash,
      expiresAt: new Date(Date.now() + CONFIRM_VALID_MS),
    });
    const link = `${ctx.config.appUrl}/sign-up/confirm/${token}`;
    mail = signUpConfirmMail({ name: input.name, companyName: input.companyName, link });
    // The built-in mail server's Outbox is per company and this mail has none yet: the person
    // running the server finds the link in its log.
    if (ctx.config.outboxEnabled) ctx.logger.info({ link }, "sign-up confirmation link (built-in mail server)");
  }
  // Queued either way (the outgoing-mail queue sends it): both paths answer in the same time.
  await ctx.mailer.send({ kind: "sign-up", to: input.email, ...mail });
}

/** Opens the company: creates it, its owner and the membership, once, from a live link. */
export async function confirmSignUp(ctx: AppContext, token: string): Promise<{ userId: string; companyId: string }> {
  return ctx.db.transaction(async (tx) => {
    const [signup] = await tx
      .update(companySignups)
      .set({ usedAt: new Date() })
      .where(
        and(
          eq(companySignups.tokenHash, hashToken(token)),
          isNull(companySignups.usedAt),
          gt(companySignups.expiresAt, new Date()),
        ),
      )
      .returning();
    if (!signup)
      throw new HttpError(400, "invalid_token", "This confirmation link is not valid any more. Sign up again.", {
        token: "is expired or already used",
      });
    const [taken] = await tx.select({ id: users.id }).from(users).where(eq(users.email, signup.email));
    if (taken)
      throw new HttpError(409, "conflict", "This address has an account now: sign in instead.", {
        email: "already has an account",
      });
    const [company] = await tx
      .insert(companies)
      .values({
        name: signup.companyName,
        ruleProfile: signup.ruleProfile,
        lengthUnit: signup.lengthUnit,
        massUnit: signup.massUnit,
        numberFormat: signup.numberFormat,
      })
      .returning();
    const [user] = await tx
      .insert(users)
      .values({ email: signup.email, name: signup.name, passwordHash: signup.passwordHash })
      .returning();
    await tx.insert(memberships).values({ companyId: company.id, userId: user.id, role: "owner" });
    return { userId: user.id, companyId: company.id };
  });
}
