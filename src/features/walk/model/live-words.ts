import type { Fixture } from "#core/contracts/fixtures";
import type { NumberFormat } from "#core/domain/numbers/number-format";
import type { LengthPreference } from "#core/domain/units/format-units";
import { wordsContext } from "#core/domain/locator-words/present-analysis";
import type { WordsContext } from "#core/domain/locator-words/words-context";

/** The live guide's words: the plan's names for fixtures and risk points, the member's length unit. */
export function liveWordsContext(
  fixtures: readonly Fixture[],
  length: LengthPreference,
  numbers: NumberFormat,
  timeConstantS: number,
): WordsContext {
  const names = new Map(fixtures.map((f) => [f.id, f.label]));
  return wordsContext({ length, mass: "kg", numbers, names, delaySetByHand: false }, timeConstantS);
}
