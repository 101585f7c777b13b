import type { LocatorInput } from "../../contracts/locator-input";
import type { Diagnostic, LocatorOutput, LocatorResult } from "../../contracts/locator-output";
import { assumptionWords } from "./assumption-words";
import { diagnosticWords } from "./diagnostic-words";
import { defaultRefrigerant } from "./spot-refrigerant";
import { gramsPerYear, nextCheckWords, spotReasonWords } from "./spot-words";
import { commandLineContext } from "./words-context";

/**
 * The command-line contract's answer (docs/locator/command-line.md) from the locator's facts: metres, ids
 * as names, and the strength in g/yr of the default blend, since the contract knows no systems.
 */
export function commandLineOutput(input: Pick<LocatorInput, "instrument">, result: LocatorResult): LocatorOutput {
  const ctx = commandLineContext(input.instrument.timeConstantS);
  const refrigerant = defaultRefrigerant("no-systems-known");
  const diagnostics: Diagnostic[] = result.diagnostics.map((d) => ({
    kind: d.kind,
    message: diagnosticWords(d, ctx),
    ...(d.kind === "fans-mixing" ? { fixtureId: d.fixtureId } : {}),
    ...(d.kind === "benign-source" ? { zoneId: d.zoneId } : {}),
  }));
  return {
    candidates: result.candidates.map((c) => ({
      rank: c.rank,
      x: c.x,
      y: c.y,
      radius: c.radius,
      score: c.score,
      strength: c.strength,
      strengthGPerYear: Math.round(gramsPerYear(c, refrigerant)),
      fixtureId: c.fixtureId,
      riskPointId: c.riskPointId,
      reason: spotReasonWords(c.reason, ctx),
      nextCheck: nextCheckWords(c.nextChecks, ctx),
    })),
    background: result.background,
    diagnostics,
    assumptions: assumptionWords(
      result.assumptions,
      result.candidates.map((c) => ({ rank: c.rank, refrigerant })),
      ctx,
    ),
  };
}
