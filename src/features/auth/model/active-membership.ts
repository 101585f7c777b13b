import type { SessionInfo } from "#core/contracts/auth";

export type Membership = SessionInfo["memberships"][number];

/** The membership of the company the person is working in now, or null. */
export function activeMembership(session: SessionInfo): Membership | null {
  if (!session.user || !session.activeCompanyId) return null;
  return session.memberships.find((m) => m.companyId === session.activeCompanyId) ?? null;
}
