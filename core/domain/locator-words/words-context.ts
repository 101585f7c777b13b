import type { LocatorFixtureKind, LocatorRiskPointKind } from "../../contracts/locator-input";
import type { LengthPreference, MassPreference } from "../units/format-units";
import type { NumberFormat } from "../numbers/number-format";

/** What the words depend on: the reader's units and number style, the names on the plan, the instrument. */
export interface WordsContext {
  length: LengthPreference;
  mass: MassPreference;
  numbers: NumberFormat;
  /** The name the lead tech gave a fixture, risk point or zone (by the locator's id); null when it has none. */
  name(id: string): string | null;
  /** The time constant of this analysis, s: the locator's shifts are the delay plus it. */
  timeConstantS: number;
  /** The delay was set by hand for this map (not the detector's own). */
  delaySetByHand: boolean;
}

export const FIXTURE_KIND_WORDS: Record<LocatorFixtureKind, string> = {
  "open-case": "open case",
  "island-case": "island case",
  "door-case": "glass-door case",
  "walk-in": "walk-in",
  "machine-room": "machine room",
};

export const RISK_POINT_WORDS: Record<LocatorRiskPointKind, string> = {
  "line-set": "line-set drop",
  valve: "valve",
  coil: "coil",
};

/** "the open case Meat 2", or "an unnamed open case" when nobody named it. */
export function fixtureWords(ctx: WordsContext, id: string, kind: LocatorFixtureKind): string {
  const name = ctx.name(id);
  return name ? `the ${FIXTURE_KIND_WORDS[kind]} ${name}` : `an unnamed ${FIXTURE_KIND_WORDS[kind]}`;
}

export function riskPointWords(ctx: WordsContext, id: string, kind: LocatorRiskPointKind): string {
  const name = ctx.name(id);
  return name ? `the ${RISK_POINT_WORDS[kind]} ${name}` : `the nearest ${RISK_POINT_WORDS[kind]}`;
}

/** The command line's own words: metres, kg, ids as names (docs/locator/command-line.md). */
export function commandLineContext(timeConstantS: number): WordsContext {
  return {
    length: "m",
    mass: "kg",
    numbers: "1,234.5",
    name: (id) => id,
    timeConstantS,
    delaySetByHand: false,
  };
}
