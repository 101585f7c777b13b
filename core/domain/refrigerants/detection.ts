import { getPure } from "./catalogue";
import { elementCounts, isHalogenated } from "./formula";
import { componentsOf, designationOf, type PureRefrigerant, type Refrigerant } from "./types";

/** Sensing principles as recorded on a detector. */
export type SensingPrinciple = "heated-diode" | "infrared" | "other";
/** Absorption band of an infrared instrument, when the detector record says it (docs/reference/standards.md §6 [M]). */
export type InfraredBand = "C-F" | "C-H" | "CO2";

export interface DetectionVerdict {
  answer: "yes" | "no" | "unknown";
  reason: string;
}

// Sensor facts here are from memory (docs/reference/standards.md §6 [M]); readers see the fact, not the note.
/** Our own rule for blends: seen when at least half the mass is visible, blind when none is. */
const BLEND_VISIBLE_SHARE = 50;

function pureVerdict(principle: SensingPrinciple, r: PureRefrigerant, band?: InfraredBand): DetectionVerdict {
  if (principle === "heated-diode") {
    if (isHalogenated(r.formula)) {
      const weak = r.id === "R-32" ? " It reads R-32 more weakly than HCFCs; keep the probe slow and close." : "";
      return {
        answer: "yes",
        reason: `${r.id} is halogenated, and heated-diode sensors respond to halogen compounds.${weak}`,
      };
    }
    return {
      answer: "no",
      reason: `Heated-diode sensors are blind to ${r.id}, which has no fluorine or chlorine.`,
    };
  }
  if (principle === "infrared") {
    if (!band) {
      return {
        answer: "unknown",
        reason:
          "Infrared sensors are band-specific (C–F ≈ 8–10 µm for HFCs/HFOs, C–H ≈ 3.3 µm for hydrocarbons, 4.26 µm for CO2); record the detector's band to check.",
      };
    }
    if (band === "C-F") {
      return (elementCounts(r.formula).F ?? 0) > 0
        ? { answer: "yes", reason: `${r.id} has C–F bonds, which absorb in this instrument's band.` }
        : { answer: "no", reason: `${r.id} has no C–F bonds, so a C–F band instrument does not see it.` };
    }
    if (band === "CO2") {
      return r.id === "R-744"
        ? {
            answer: "yes",
            reason: "CO2 absorbs at 4.26 µm; the ~420 ppm background masks small R-744 leaks.",
          }
        : { answer: "no", reason: `A CO2-band instrument does not see ${r.id}.` };
    }
    if (r.kind === "HC")
      return { answer: "yes", reason: `${r.id} is a hydrocarbon; C–H band instruments are made for these.` };
    return {
      answer: "unknown",
      reason: `Whether a C–H band instrument reads ${r.id} depends on the instrument; check the maker's list.`,
    };
  }
  return { answer: "unknown", reason: "For this sensing principle, check the maker's list of refrigerants." };
}

/**
 * Can a detector of this principle see this refrigerant? Feeds the Walk screen's mismatch warning
 * (a heated-diode instrument on an R-290 case would read nothing and prove nothing).
 */
export function canDetect(
  principle: SensingPrinciple,
  r: Refrigerant,
  options: { band?: InfraredBand } = {},
): DetectionVerdict {
  const components = componentsOf(r);
  const name = designationOf(r);
  if (!components) {
    if (r.kind !== "company") return pureVerdict(principle, r as PureRefrigerant, options.band);
    return { answer: "unknown", reason: `${name} was entered without a composition; check the maker's list.` };
  }
  const verdicts = components.map((c) => ({ c, v: pureVerdict(principle, getPure(c.id), options.band) }));
  if (verdicts.some(({ v }) => v.answer === "unknown")) {
    return { answer: "unknown", reason: verdicts.find(({ v }) => v.answer === "unknown")!.v.reason };
  }
  const visible = verdicts.filter(({ v }) => v.answer === "yes");
  const share = visible.reduce((s, { c }) => s + c.massPercent, 0);
  const seen = visible.map(({ c }) => c.id).join(", ");
  if (share === 0) return { answer: "no", reason: `This instrument sees none of ${name}'s components.` };
  if (share >= BLEND_VISIBLE_SHARE) {
    return { answer: "yes", reason: `It sees ${seen}, ${share.toFixed(1).replace(/\.0$/, "")}% of ${name} by mass.` };
  }
  return {
    answer: "unknown",
    reason: `It sees only ${seen}, ${share}% of ${name} by mass; a leak may read far lower than the blend's concentration.`,
  };
}
