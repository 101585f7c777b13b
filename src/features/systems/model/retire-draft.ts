import { RETIRE_REASONS, retireInput, type RetireInput } from "#core/contracts/systems";
import { formatCalendarDay } from "#core/domain/dates/format-in-zone";
import { zodFieldErrors, type FieldErrors } from "../../../lib/form-errors";

export interface RetireDraft {
  retiredOn: string;
  reasonKind: (typeof RETIRE_REASONS)[number] | "";
  reason: string;
}

/**
 * The retire dialog's input, or the field errors to show before sending: the day on or before
 * today and not before the in-service day (the server checks the store's calendar and the last
 * record too), a reason picked, and words for "other".
 */
export function readRetireDraft(
  draft: RetireDraft,
  bounds: { today: string; inServiceOn: string },
): { input: RetireInput; errors: null } | { input: null; errors: FieldErrors } {
  const parsed = retireInput.safeParse(draft);
  const errors: FieldErrors = parsed.success ? {} : zodFieldErrors(parsed.error);
  if (draft.reasonKind === "") errors.reasonKind = "pick why the system left service";
  if (!errors.retiredOn && draft.retiredOn > bounds.today)
    errors.retiredOn = `must not be after today (${formatCalendarDay(bounds.today)})`;
  if (!errors.retiredOn && draft.retiredOn < bounds.inServiceOn)
    errors.retiredOn = `must not be before the day it entered service (${formatCalendarDay(bounds.inServiceOn)})`;
  if (!parsed.success || Object.keys(errors).length > 0) return { input: null, errors };
  return { input: parsed.data, errors: null };
}
