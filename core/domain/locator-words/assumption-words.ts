import type { LocatorAssumptions } from "../../contracts/locator-output";
import { lengthWords } from "./length-words";
import { formatGrouped, formatShort } from "../numbers/number-format";
import { spotRefrigerantName, type SpotRefrigerant } from "./spot-refrigerant";
import type { WordsContext } from "./words-context";

const DEFAULT_WHY: Record<Extract<SpotRefrigerant, { source: "default" }>["why"], string> = {
  "no-fixture": "no fixture is near",
  "no-system": "the nearest fixture is linked to no system",
  "unknown-refrigerant": "the system's refrigerant is not in the catalogue",
  "no-systems-known": "no system is known",
};

const spotList = (ranks: number[]) =>
  ranks.length === 1 ? `spot ${ranks[0]}` : `spots ${ranks.slice(0, -1).join(", ")} and ${ranks[ranks.length - 1]}`;

/** Which refrigerant each spot's strength is weighed in, grouped: "R-448A (86.28 g/mol, Rack A) for spots 1 and 2". */
function refrigerantWords(spots: readonly { rank: number; refrigerant: SpotRefrigerant }[], ctx: WordsContext): string {
  const groups = new Map<string, { r: SpotRefrigerant; ranks: number[] }>();
  for (const s of spots) {
    const key = `${s.refrigerant.refrigerantId}|${s.refrigerant.source === "system" ? s.refrigerant.systemName : s.refrigerant.why}`;
    const g = groups.get(key) ?? { r: s.refrigerant, ranks: [] };
    g.ranks.push(s.rank);
    groups.set(key, g);
  }
  return [...groups.values()]
    .map(({ r, ranks }) => {
      const m = `${formatGrouped(r.molarMassGPerMol, ctx.numbers, 2)} g/mol`;
      if (r.source === "system" && r.molarMassAssumedFrom)
        return `${spotRefrigerantName(r)} (molar mass not known, so ${r.molarMassAssumedFrom}'s ${m} assumed; the refrigerant of ${r.systemName}) for ${spotList(ranks)}`;
      return r.source === "system"
        ? `${spotRefrigerantName(r)} (${m}, the refrigerant of ${r.systemName}) for ${spotList(ranks)}`
        : `${r.refrigerantId} (${m}), a default blend because ${DEFAULT_WHY[r.why]}, for ${spotList(ranks)}`;
    })
    .join("; ");
}

/** The assumptions behind positions and strengths, and the safety reminder, as sentences. */
export function assumptionWords(
  a: LocatorAssumptions,
  spots: readonly { rank: number; refrigerant: SpotRefrigerant }[],
  ctx: WordsContext,
): string[] {
  const temperature =
    ctx.length === "ft-in"
      ? `${formatShort(a.temperatureC, ctx.numbers)} °C (${formatShort((a.temperatureC * 9) / 5 + 32, ctx.numbers)} °F)`
      : `${formatShort(a.temperatureC, ctx.numbers)} °C`;
  const anySystem = spots.some((s) => s.refrigerant.source === "system");
  const weighed =
    spots.length === 0
      ? ""
      : ` The mass is that of ${anySystem ? "the refrigerant of the nearest fixture's system: " : ""}${refrigerantWords(spots, ctx)}.`;
  return [
    `Readings moved back along the walk by the transport delay plus the sensor time constant (${formatShort(a.shiftS, ctx.numbers)} s).`,
    `Strength per year assumes the store air is well mixed over ${lengthWords(a.mixingHeightM, ctx.length, ctx.numbers)} height with ${formatShort(a.airChangesPerH, ctx.numbers)} air changes per hour, ` +
      `at ${temperature} and ${formatGrouped(a.pressureKPa, ctx.numbers, 3)} kPa (${formatGrouped(a.molarVolumeL, ctx.numbers, 3)} L/mol); treat it as an order of magnitude.${weighed}`,
    "Suspect spots are search zones for a hand check, not pinpoints; follow local codes and certified practice when working on the system.",
  ];
}
