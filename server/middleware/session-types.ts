import "express-session";

declare module "express-session" {
  interface SessionData {
    userId?: string;
    activeCompanyId?: string;
    csrfToken?: string;
    /** When and from what browser this sign-in happened (the person's own session list). */
    signedInAt?: string;
    userAgent?: string;
  }
}
