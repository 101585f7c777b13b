import type { SessionInfo } from "#core/contracts/auth";
import { can, type Role } from "#core/domain/roles";

export interface NavItem {
  to: string;
  label: string;
}

/**
 * What the navigation offers to a role. It only hides what would be refused: the server
 * enforces every permission on its own (core/domain/roles.ts is shared by both sides).
 */
export function navItems(role: Role, session: Pick<SessionInfo, "outboxEnabled">): NavItem[] {
  // Today first: the landing page for the people who answer for the books (see routes/home.tsx).
  const items: NavItem[] = [
    { to: "/today", label: "Today" },
    { to: "/stores", label: "Stores" },
  ];
  if (can(role, "sweeps.record")) items.push({ to: "/walk", label: "Walk" });
  if (can(role, "detectors.read")) items.push({ to: "/detectors", label: "Detectors" });
  if (can(role, "members.read")) items.push({ to: "/team", label: "Team" });
  // Every member may read the company's settings; only settings.manage may change them.
  items.push({ to: "/settings", label: "Company settings" });
  if (session.outboxEnabled && can(role, "outbox.read")) items.push({ to: "/outbox", label: "Outbox" });
  items.push({ to: "/help", label: "Help" });
  return items;
}
