import { describe, expect, it } from "vitest";
import { EU_FGAS_PROFILE } from "../domain/compliance/eu-fgas-profile";
import { US_FEDERAL_PROFILE } from "../domain/compliance/us-federal-profile";
import { anyRuleProfileSchema, RULE_PROFILE_FIELDS } from "./rule-profile";

const at = (node: unknown, path: string): unknown =>
  path
    .split(".")
    .reduce<unknown>((n, k) => (n && typeof n === "object" ? (n as Record<string, unknown>)[k] : undefined), node);

describe("the rule profile is described once", () => {
  it("describes the built-in profiles: the domain's data passes the contract's schema", () => {
    for (const p of [US_FEDERAL_PROFILE, EU_FGAS_PROFILE]) {
      const r = anyRuleProfileSchema.safeParse(p);
      expect(r.success, JSON.stringify(r.error?.issues.slice(0, 3))).toBe(true);
    }
  });

  it("labels only paths the profiles have (a leak-rate part's fields under its part)", () => {
    const parts = [...US_FEDERAL_PROFILE.leakRateParts, ...EU_FGAS_PROFILE.leakRateParts];
    for (const key of Object.keys(RULE_PROFILE_FIELDS)) {
      const found = [US_FEDERAL_PROFILE, EU_FGAS_PROFILE, ...parts].some((node) => at(node, key) !== undefined);
      expect(found, key).toBe(true);
    }
  });
});
