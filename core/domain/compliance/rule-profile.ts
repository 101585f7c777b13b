import type { z } from "zod";
import type {
  anyRuleProfileSchema,
  leakCheckBandSchema,
  leakRatePartSchema,
  massLimitSchema,
} from "../../contracts/rule-profile";

/**
 * A rule profile is the data a company works under. Every threshold, deadline, interval and date
 * lives there with its source tag (docs/reference/standards.md: [S:id] sourced, [M] from memory, [D] derived), so
 * that when a regulation changes only the data changes; the functions in this folder read it.
 *
 * The shape is described once, by the zod schemas of core/contracts/rule-profile.ts (what each
 * field means is written there); these types are inferred from them, so the domain, the API and
 * the custom-profile form cannot drift apart.
 */

export type ApplianceType = "commercial-refrigeration" | "industrial-process" | "comfort-cooling";
export const APPLIANCE_TYPES: readonly ApplianceType[] = [
  "commercial-refrigeration",
  "industrial-process",
  "comfort-cooling",
];

export type LeakRateMethod = "annualizing" | "rolling-average";

export type MassLimit = z.infer<typeof massLimitSchema>;
/** One US leak-repair regime (40 CFR 82 subpart F or 40 CFR 84 subpart C). */
export type LeakRatePart = z.infer<typeof leakRatePartSchema>;
/** An EU leak-check band by CO2e (Annex I gases) or by kg (HFOs); lower edge inclusive, upper exclusive. */
export type LeakCheckBand = z.infer<typeof leakCheckBandSchema>;
export type RuleProfile = z.infer<typeof anyRuleProfileSchema>;
export type LeakCheckRules = NonNullable<RuleProfile["leakChecks"]>;
