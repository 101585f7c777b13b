import "express-session";

declare module "express-session" {
  interface SessionData {
    userId?: string;
    activeCompanyId?: string;
    csrfToken?: string;
  }
}
