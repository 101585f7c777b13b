import type { RequestHandler } from "express";
import type { SessionData } from "express-session";
import { and, eq } from "drizzle-orm";
import type { Db } from "../db/client";
import { memberships, membershipStores, users } from "../db/schema/index";
import { can, isStoreScoped, type Permission, type Role } from "#core/domain/roles";
import { HttpError, forbidden } from "../lib/http-error";

export interface AuthContext {
  user: { id: string; email: string; name: string; lengthUnit: "m" | "ft-in" | null; massUnit: "kg" | "lb" | null };
  membership: { id: string; companyId: string; role: Role; storeIds: string[] } | null;
}

declare module "express-serve-static-core" {
  interface Request {
    auth?: AuthContext;
  }
}

/** The signed-in user and their membership in the session's active company, or undefined. */
export async function readAuth(db: Db, session: Partial<SessionData>): Promise<AuthContext | undefined> {
  const userId = session.userId;
  if (!userId) return undefined;
  const [user] = await db
    .select({
      id: users.id,
      email: users.email,
      name: users.name,
      lengthUnit: users.lengthUnit,
      massUnit: users.massUnit,
    })
    .from(users)
    .where(eq(users.id, userId));
  if (!user) return undefined;
  const companyId = session.activeCompanyId;
  if (!companyId) return { user, membership: null };
  const [m] = await db
    .select({ id: memberships.id, companyId: memberships.companyId, role: memberships.role })
    .from(memberships)
    .where(and(eq(memberships.userId, user.id), eq(memberships.companyId, companyId)));
  if (!m) return { user, membership: null };
  const storeIds = isStoreScoped(m.role)
    ? (
        await db
          .select({ storeId: membershipStores.storeId })
          .from(membershipStores)
          .where(eq(membershipStores.membershipId, m.id))
      ).map((r) => r.storeId)
    : [];
  return { user, membership: { ...m, storeIds } };
}

/** Puts readAuth's answer on req.auth for every request (a removed member loses access at once). */
export function loadAuth(db: Db): RequestHandler {
  return async (req, _res, next) => {
    req.auth = await readAuth(db, req.session ?? {});
    next();
  };
}

export const requireUser: RequestHandler = Object.assign<RequestHandler, { requires: { user: true } }>(
  (req, _res, next) => {
    if (!req.auth) throw new HttpError(401, "not_signed_in", "Please sign in.");
    next();
  },
  { requires: { user: true } },
);

/** Signed in, with an active company; optionally holding a permission. */
export function requireMember(permission?: Permission): RequestHandler {
  const handler: RequestHandler = (req, _res, next) => {
    if (!req.auth) throw new HttpError(401, "not_signed_in", "Please sign in.");
    const m = req.auth.membership;
    if (!m) throw new HttpError(403, "no_company", "Choose a company first.");
    if (permission && !can(m.role, permission)) throw forbidden();
    next();
  };
  // Tagged so the route table (server/lib/route-table.ts) knows who may call each route.
  return Object.assign(handler, { requires: { user: true, member: true, permission } });
}

export function member(req: { auth?: AuthContext }): NonNullable<AuthContext["membership"]> {
  const m = req.auth?.membership;
  if (!m) throw new HttpError(403, "no_company", "Choose a company first.");
  return m;
}
