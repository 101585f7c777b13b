import { findRefrigerant } from "../refrigerants/catalogue";
import { designationOf, type Refrigerant } from "../refrigerants/types";
import { canDetect, type SensingPrinciple } from "../refrigerants/detection";
import type { SweepWarning } from "../../contracts/sweeps";

export interface WarningDetector {
  name: string;
  principle: SensingPrinciple;
  overdue: boolean;
  checkDueOn: string | null;
}

export interface WarningSystem {
  id: string;
  name: string;
  refrigerantId: string;
}

/**
 * What the technician should know before walking: an overdue calibration / bump check, and
 * hunted refrigerants the detector cannot see (a heated-diode sensor on
 * reads nothing and proves nothing; docs/reference/standards.md via canDetect). Pure, so the Walk screen can
 * show the same warnings when a sweep starts offline.
 */
export function startWarnings(
  detector: WarningDetector,
  systems: readonly WarningSystem[],
  lookup: (id: string) => Refrigerant | undefined = findRefrigerant,
): SweepWarning[] {
  const out: SweepWarning[] = [];
  if (detector.overdue) {
    out.push({
      code: "detector-overdue",
      message: detector.checkDueOn
        ? `${detector.name} was due for calibration / bump check on ${detector.checkDueOn}. Check it before trusting a zero.`
        : `${detector.name} has no calibration / bump check on record. Check it before trusting a zero.`,
    });
  }
  for (const s of systems) {
    const r = lookup(s.refrigerantId);
    if (!r) continue;
    const named = designationOf(r);
    const v = canDetect(detector.principle, r);
    if (v.answer === "no") {
      out.push({
        code: "detector-blind",
        systemId: s.id,
        message: `${detector.name} cannot see ${named} on ${s.name}: ${v.reason} Use a detector made for this refrigerant.`,
      });
    } else if (v.answer === "unknown") {
      out.push({
        code: "detector-unsure",
        systemId: s.id,
        message: `${detector.name} may not see ${named} on ${s.name}: ${v.reason}`,
      });
    }
  }
  return out;
}
