import type { Fixture } from "#core/contracts/fixtures";
import type { RefrigerantSummary } from "#core/contracts/systems";
import { refrigerantOfSummary } from "#core/domain/refrigerants/company-refrigerant";
import { pinpointPassCautions } from "#core/domain/safety/pinpoint-cautions";
import type { CautionPlace } from "#core/domain/safety/cautions";
import { roomSystemIds } from "./room-entry";

/** Where a still-air pass is walked, for its cautions: a walk-in, the machine room, or a case on the sales floor. */
export function passPlace(fixture: Pick<Fixture, "kind"> | undefined): CautionPlace {
  if (fixture?.kind === "machine-room") return "machine-room";
  if (fixture?.kind === "walk-in-cooler" || fixture?.kind === "walk-in-freezer") return "walk-in";
  return "sales-floor";
}

/**
 * The cautions of a still-air pass over `fixture` (null: the whole store), for the refrigerants of the
 * systems it hangs off: shown before it starts, and with the pass while it runs.
 */
export function passCautions(
  fixture: Fixture | undefined,
  fixtures: readonly Fixture[],
  systems: readonly { id: string; refrigerant: RefrigerantSummary }[],
) {
  const ids = fixture ? roomSystemIds(fixtures, fixture) : systems.map((s) => s.id);
  const refrigerants = systems.filter((s) => ids.includes(s.id)).map((s) => refrigerantOfSummary(s.refrigerant));
  return pinpointPassCautions(passPlace(fixture), refrigerants);
}
