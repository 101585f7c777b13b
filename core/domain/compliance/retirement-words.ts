import { RETIRE_REASON_NAMES, type System } from "../../contracts/systems";

/**
 * Why a system left service, in words: the reason's name and its note, or for "other" the words
 * given; systems retired before the reason was asked keep what was typed then (possibly nothing).
 */
export function retireReasonWords(retired: NonNullable<System["retired"]>): string {
  if (retired.reasonKind === null || retired.reasonKind === "other") return retired.reason;
  const name = RETIRE_REASON_NAMES[retired.reasonKind];
  return retired.reason ? `${name}: ${retired.reason}` : name;
}
