import type { Request, RequestHandler } from "express";
import { randomBytes, timingSafeEqual } from "node:crypto";
import { HttpError } from "../lib/http-error";

// Synchronizer token kept in the session (OWASP CSRF cheat sheet): every state-changing
// request must echo it in X-CSRF-Token. SameSite=Lax cookies are the second layer.
const SAFE = new Set(["GET", "HEAD", "OPTIONS"]);

/**
 * A session that holds nothing but the sign-in form's token lives an hour, not the signed-in 30 days
 * (docs/decisions/0027-sessions-before-sign-in.md); the rolling cookie renews it while the form is in use.
 */
export const ANONYMOUS_SESSION_MS = 60 * 60 * 1000;

function limitAnonymous(req: Request): void {
  if (!req.session.userId) req.session.cookie.maxAge = ANONYMOUS_SESSION_MS;
}

export function issueCsrfToken(req: Request): string {
  if (!req.session.csrfToken) req.session.csrfToken = randomBytes(32).toString("base64url");
  limitAnonymous(req);
  return req.session.csrfToken;
}

export function rotateCsrfToken(req: Request): string {
  req.session.csrfToken = randomBytes(32).toString("base64url");
  limitAnonymous(req);
  return req.session.csrfToken;
}

export const csrfProtection: RequestHandler = (req, _res, next) => {
  if (SAFE.has(req.method)) return next();
  const sent = req.get("x-csrf-token") ?? "";
  const expected = req.session?.csrfToken ?? "";
  const ok =
    expected.length > 0 && sent.length === expected.length && timingSafeEqual(Buffer.from(sent), Buffer.from(expected));
  if (!ok)
    throw new HttpError(
      403,
      "csrf_failed",
      "Your session has expired or the page is out of date. Reload the page and try again.",
    );
  next();
};
