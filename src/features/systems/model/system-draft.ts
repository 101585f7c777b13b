import type { ApplianceType, ChargeInput, RevisionInput, System } from "#core/contracts/systems";
import { parseGroupedNumber, formatQuantity, type NumberFormat } from "#core/domain/numbers/number-format";
import { kgToPounds } from "#core/domain/units/mass";
import type { MassPreference } from "#core/domain/units/format-units";

/** The system form as typed: the charge stays text until it is read in the company's number format. */
export interface SystemDraft {
  name: string;
  refrigerantId: string;
  charge: string;
  unit: MassPreference;
  applianceType: ApplianceType;
  automaticLeakDetection: boolean;
  /** A property of the equipment, not a dated fact: changed by a plain edit (decision 0122). */
  hermeticallySealed: boolean;
  inServiceOn: string;
}

/** A stored charge as the form shows it: in the chosen unit, grouped, up to three places. */
export function chargeText(kg: number, unit: MassPreference, format: NumberFormat): string {
  return formatQuantity(unit === "lb" ? kgToPounds(kg) : kg, format, 3);
}

export function draftOf(system: System, unit: MassPreference, format: NumberFormat): SystemDraft {
  return {
    name: system.name,
    refrigerantId: system.refrigerantId,
    charge: chargeText(system.fullChargeKg, unit, format),
    unit,
    applianceType: system.applianceType,
    automaticLeakDetection: system.automaticLeakDetection,
    hermeticallySealed: system.hermeticallySealed,
    inServiceOn: system.inServiceOn,
  };
}

/**
 * The charge as the server will get it, or the reason it cannot be read. A charge the form cannot
 * read goes out as NaN so the shared schema names the field ("must be a finite number").
 */
export function readCharge(draft: Pick<SystemDraft, "charge" | "unit">, format: NumberFormat) {
  const parsed = parseGroupedNumber(draft.charge, format);
  const charge: ChargeInput = { value: parsed.ok ? parsed.value : Number.NaN, unit: draft.unit };
  return {
    charge,
    problem: parsed.ok ? null : parsed.reason,
    echo: parsed.ok ? `${formatQuantity(parsed.value, format, 3)} ${draft.unit}` : null,
  };
}

/**
 * The dated facts the edit changes, compared with what the form opened with (a charge counts as
 * changed when its text or unit was changed: re-reading a rounded figure must not move history).
 */
export function changedFacts(
  before: SystemDraft,
  after: SystemDraft,
  format: NumberFormat,
): Omit<RevisionInput, "effectiveFrom" | "kind" | "reason"> {
  const facts: Omit<RevisionInput, "effectiveFrom" | "kind" | "reason"> = {};
  if (after.refrigerantId !== before.refrigerantId) facts.refrigerantId = after.refrigerantId;
  if (after.charge.trim() !== before.charge.trim() || after.unit !== before.unit)
    facts.fullCharge = readCharge(after, format).charge;
  if (after.applianceType !== before.applianceType) facts.applianceType = after.applianceType;
  if (after.automaticLeakDetection !== before.automaticLeakDetection)
    facts.automaticLeakDetection = after.automaticLeakDetection;
  if (after.inServiceOn !== before.inServiceOn) facts.inServiceOn = after.inServiceOn;
  return facts;
}
