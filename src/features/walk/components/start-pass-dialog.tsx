import { useEffect, useRef, useState } from "react";
import type { Fixture } from "#core/contracts/fixtures";
import { FIXTURE_KIND_NAMES } from "#core/contracts/fixture-kinds";
import type { RefrigerantSummary } from "#core/contracts/systems";
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
import { passCautions } from "../model/pass-cautions";

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
  // The dialog focuses its first control as it opens, scrolling the cautions above it out of sight on a
  // phone: they take the focus instead (this runs after the dialog's own effect), so they show in full.
  const cautionsRef = useRef<HTMLDivElement>(null);
  useEffect(() => cautionsRef.current?.focus(), []);
  const name = fixture.label || FIXTURE_KIND_NAMES[fixture.kind];
  return (
    <Dialog title={`Still-air pass at ${name}`} open onClose={onClose}>
      {/* first, so they show in full on a phone as the pass starts (the running pass keeps them one tap away) */}
      <div data-testid="start-pass-cautions" ref={cautionsRef} tabIndex={-1} className="outline-none">
        <Cautions items={passCautions(fixture, fixtures, systems)} title="Before you stop the fans" />
      </div>
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
