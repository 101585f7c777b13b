import type { SessionInfo } from "#core/contracts/auth";
import type { Role } from "#core/domain/roles";

// Invented companies and people for client tests.
export const COMPANY_A = "0b9e7c52-3d4f-4a1b-8c6d-2e5f7a9b1c3d";
export const COMPANY_B = "5a6b7c8d-9e0f-4a1b-9c2d-3e4f5a6b7c8d";
export const USER_ID = "7c1d2e3f-4a5b-4c6d-8e7f-9a0b1c2d3e4f";

export function signedOutSession(csrfToken = "csrf-signed-out"): SessionInfo {
  return {
    user: null,
    activeCompanyId: null,
    memberships: [],
    csrfToken,
    outboxEnabled: true,
    units: { length: "m", mass: "kg", number: "1,234.5" },
    rules: "us",
  };
}

export function sessionFor(
  role: Role,
  options: { outboxEnabled?: boolean; csrfToken?: string; twoCompanies?: boolean } = {},
): SessionInfo {
  const memberships: SessionInfo["memberships"] = [{ companyId: COMPANY_A, companyName: "Northfield Cold Care", role }];
  if (options.twoCompanies)
    memberships.push({ companyId: COMPANY_B, companyName: "Harbour Lane Grocers", role: "engineer" });
  return {
    user: { id: USER_ID, email: "ines.varga@northfield.example", name: "Ines Varga", lengthUnit: null, massUnit: null },
    activeCompanyId: COMPANY_A,
    memberships,
    csrfToken: options.csrfToken ?? "csrf-signed-in",
    outboxEnabled: options.outboxEnabled ?? true,
    units: { length: "m", mass: "kg", number: "1,234.5" },
    rules: "us",
  };
}
