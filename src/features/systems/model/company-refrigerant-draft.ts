import type { CompanyRefrigerantInput } from "#core/contracts/company-refrigerants";
import { parseGroupedNumber, type NumberFormat } from "#core/domain/numbers/number-format";

/** How the company knows its refrigerant: what it is made of, or only a GWP someone published. */
export type KnownBy = "composition" | "gwp";

/** The form as typed: numbers stay text until read in the company's number format. */
export interface CompanyRefrigerantDraft {
  name: string;
  safetyClass: string;
  knownBy: KnownBy;
  components: { refrigerantId: string; percent: string }[];
  gwp: string;
  gwpBasis: string;
  gwpSource: string;
  substanceClass: string;
  molarMass: string;
}

export const EMPTY_DRAFT: CompanyRefrigerantDraft = {
  name: "",
  safetyClass: "A1",
  knownBy: "composition",
  components: [
    { refrigerantId: "", percent: "" },
    { refrigerantId: "", percent: "" },
  ],
  gwp: "",
  gwpBasis: "AR4",
  gwpSource: "",
  substanceClass: "",
  molarMass: "",
};

/** A number the form cannot read goes out as NaN, so the shared schema names the field. */
function read(text: string, format: NumberFormat): { value: number; problem: string | null } {
  const parsed = parseGroupedNumber(text, format);
  return parsed.ok ? { value: parsed.value, problem: null } : { value: Number.NaN, problem: parsed.reason };
}

/**
 * The request the draft makes, with the reasons any number could not be read (keyed by field path),
 * and the running total of the mass per cents as read.
 */
export function readCompanyRefrigerant(draft: CompanyRefrigerantDraft, format: NumberFormat) {
  const problems: Record<string, string> = {};
  const base = { name: draft.name, safetyClass: draft.safetyClass } as CompanyRefrigerantInput;
  if (draft.knownBy === "composition") {
    const composition = draft.components.map((c, i) => {
      const p = read(c.percent, format);
      if (p.problem) problems[`composition.${i}.massPercent`] = p.problem;
      return { refrigerantId: c.refrigerantId, massPercent: p.value };
    });
    const total = composition.reduce((s, c) => s + (Number.isFinite(c.massPercent) ? c.massPercent : 0), 0);
    return { input: { ...base, composition }, problems, total };
  }
  const gwp = read(draft.gwp, format);
  if (gwp.problem) problems["statedGwp.value"] = gwp.problem;
  const mass = draft.molarMass.trim() === "" ? null : read(draft.molarMass, format);
  if (mass?.problem) problems.molarMass = mass.problem;
  const input = {
    ...base,
    ...(draft.substanceClass ? { substanceClass: draft.substanceClass } : {}),
    molarMass: mass ? mass.value : null,
    statedGwp: { value: gwp.value, basis: draft.gwpBasis, source: draft.gwpSource },
  } as CompanyRefrigerantInput;
  return { input, problems, total: null };
}
