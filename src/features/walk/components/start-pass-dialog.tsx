import { useState } from "react";
import type { Fixture } from "#core/contracts/fixtures";
import { FIXTURE_KIND_NAMES } from "#core/contracts/fixture-kinds";
import type { RefrigerantSummary } from "#core/contracts/systems";
import { refrigerantOfSummary } from "#core/domain/refrigerants/company-refrigerant";
import { pinpointPassCautions } from "#core/domain/safety/pinpoint-cautions";
import { Button } from "../../../components/ui/button";
import { Cautions } from "../../../components/ui/cautions";
import { Dialog } from "../../../components/ui/dialog";
import {
  clampRestoreMinutes,
  DEFAULT_RESTORE_AFTER_MIN,
  RESTORE_AFTER_MIN_RANGE,
  type PassCondition,
  type PassStart,
} from "../model/pinpoint-pass";
import { roomSystemIds } from "../model/room-entry";

/**
 * Starting a still-air pass over one fixture: fans stopped or a defrost, the reminder's minutes, and the
 * cautions for the place and its systems' refrigerants. Nothing is stopped by the app: the technician
 * stops the fans or starts the defrost at the case or controller, then starts the pass here.
 */
export function StartPassDialog({
  fixture,
  fixtures,
  systems,
  onStart,
  onClose,
}: {
  fixture: Fixture;
  fixtures: readonly Fixture[];
  /** The store's systems with their refrigerants, as the store pack holds them (a company's own ones too). */
  systems: readonly { id: string; refrigerant: RefrigerantSummary }[];
  onStart(start: PassStart): void;
  onClose(): void;
}) {
  const [condition, setCondition] = useState<PassCondition>("fans-stopped");
  const [minutes, setMinutes] = useState(DEFAULT_RESTORE_AFTER_MIN);
  const room =
    fixture.kind === "walk-in-cooler" || fixture.kind === "walk-in-freezer" || fixture.kind === "machine-room";
  const ids = roomSystemIds(fixtures, fixture);
  const refrigerants = systems.filter((s) => ids.includes(s.id)).map((s) => refrigerantOfSummary(s.refrigerant));
  const place = fixture.kind === "machine-room" ? "machine-room" : room ? "walk-in" : "sales-floor";
  const name = fixture.label || FIXTURE_KIND_NAMES[fixture.kind];
  return (
    <Dialog title={`Still-air pass at ${name}`} open onClose={onClose}>
      <p>
        Stop the fans of {name} (or start its defrost) at the case or its controller, then start the pass. Readings you
        take now are marked as taken in still air.
      </p>
      <fieldset className="flex flex-col gap-2">
        <legend className="font-bold">How is the air stilled?</legend>
        {(
          [
            ["fans-stopped", "Fans stopped"],
            ["defrost", "Defrost started"],
          ] as const
        ).map(([value, label]) => (
          <label key={value} className="flex min-h-12 items-center gap-3 rounded-md px-3 edge">
            <input
              type="radio"
              name="pass-condition"
              value={value}
              checked={condition === value}
              onChange={() => setCondition(value)}
            />
            {label}
          </label>
        ))}
      </fieldset>
      <div className="flex items-center gap-2">
        <span className="flex-1">Remind me to restore the fans after</span>
        <Button
          variant="secondary"
          aria-label="5 minutes less"
          onClick={() => setMinutes((m) => clampRestoreMinutes(m - 5))}
          disabled={minutes <= RESTORE_AFTER_MIN_RANGE.min}
        >
          −
        </Button>
        <output className="w-16 text-center font-bold" data-testid="pass-minutes">
          {minutes} min
        </output>
        <Button
          variant="secondary"
          aria-label="5 minutes more"
          onClick={() => setMinutes((m) => clampRestoreMinutes(m + 5))}
          disabled={minutes >= RESTORE_AFTER_MIN_RANGE.max}
        >
          +
        </Button>
      </div>
      <Cautions items={pinpointPassCautions(place, refrigerants)} title="Before you stop the fans" />
      <div className="flex gap-2">
        <Button variant="secondary" className="flex-1" onClick={onClose}>
          Not now
        </Button>
        <Button
          className="flex-1"
          onClick={() => onStart({ condition, fixtureId: fixture.id, restoreAfterMin: minutes })}
        >
          Start still-air pass
        </Button>
      </div>
    </Dialog>
  );
}
