import { useState } from "react";
import type { Plan } from "#core/contracts/plans";
import { Alert } from "../../../../components/ui/alert";
import { Button } from "../../../../components/ui/button";
import { Checkbox } from "../../../../components/ui/checkbox";
import { Spinner } from "../../../../components/ui/spinner";
import { formErrorMessage, serverFieldErrors } from "../../../../lib/form-errors";
import { usePlan } from "../../../../entities/plans/plans-api";
import { useSetAlignment } from "../../api/set-alignment";
import { imageToPlan, type ImagePoint } from "../../../../lib/plan-view/coordinates";
import { ImagePointPicker } from "./image-point-picker";

/**
 * Lines a new plan version up with the one before: the lead tech marks the same two places
 * (two column corners, say) on the old and the new drawing, shown side by side.
 */
export function AlignmentPanel({ plan, onDone }: { plan: Plan; onDone: (plan: Plan) => void }) {
  const previous = usePlan(plan.previousPlanId ?? "");
  const [old, setOld] = useState<ImagePoint[]>([]);
  const [now, setNow] = useState<ImagePoint[]>([]);
  const [moveFixtures, setMoveFixtures] = useState(true);
  const align = useSetAlignment();

  if (!plan.previousPlanId) return null;
  if (previous.isPending) return <Spinner label="Loading the previous version…" />;
  if (!previous.data) return <Alert tone="error">The previous version could not be loaded.</Alert>;
  const prev = previous.data;
  if (!prev.image || !prev.metresPerPixel || !plan.image || !plan.metresPerPixel) {
    return (
      <Alert tone="note">
        Both versions need a calibrated drawing before they can be matched. Set this version's scale first.
      </Alert>
    );
  }
  const prevMpp = prev.metresPerPixel;
  const mpp = plan.metresPerPixel;

  function save() {
    const toPlan = (p: ImagePoint, m: number) => {
      const q = imageToPlan(p, m);
      return { x: q.x, y: q.y };
    };
    align.mutate(
      {
        planId: plan.id,
        input: {
          previous: [toPlan(old[0], prevMpp), toPlan(old[1], prevMpp)],
          current: [toPlan(now[0], mpp), toPlan(now[1], mpp)],
          moveFixtures,
          layoutRevision: plan.layoutRevision,
        },
      },
      { onSuccess: (saved) => onDone(saved) },
    );
  }

  const fields = serverFieldErrors(align.error);
  const fieldText = Object.entries(fields).map(
    ([k, v]) =>
      `${k.startsWith("previous") ? "Old drawing" : "New drawing"}, point ${Number(k.split(".")[1]) + 1}: ${v}`,
  );
  const error = formErrorMessage(align.error);
  return (
    <section aria-labelledby="align-heading" className="space-y-3 rounded-md bg-surface p-4 edge">
      <h3 id="align-heading" className="text-lg font-bold">
        Match version {plan.version} to version {prev.version}
      </h3>
      <p className="max-w-prose">
        Mark the same two places, far apart, on both drawings: 1 then 2 on the old one, 1 then 2 on the new one. Sweeps
        on the two versions can then be compared.
      </p>
      {plan.alignmentMatched ? (
        <Alert tone="success">This version is matched to the previous one. Mark points again to redo it.</Alert>
      ) : null}
      {error ? <Alert tone="error">{error}</Alert> : null}
      {fieldText.length ? (
        <ul className="font-bold text-danger">
          {fieldText.map((t) => (
            <li key={t}>{t}</li>
          ))}
        </ul>
      ) : null}
      <div className="grid gap-4 lg:grid-cols-2">
        <div>
          <p className="font-bold">Version {prev.version} (old)</p>
          <ImagePointPicker
            imageUrl={prev.image.displayUrl}
            widthPx={prev.image.widthPx}
            heightPx={prev.image.heightPx}
            points={old}
            onChange={setOld}
            names={["1", "2"]}
            joined={false}
            label="Old drawing"
            height={340}
          />
        </div>
        <div>
          <p className="font-bold">Version {plan.version} (new)</p>
          <ImagePointPicker
            imageUrl={plan.image.displayUrl}
            widthPx={plan.image.widthPx}
            heightPx={plan.image.heightPx}
            points={now}
            onChange={setNow}
            names={["1", "2"]}
            joined={false}
            label="New drawing"
            height={340}
          />
        </div>
      </div>
      <Checkbox
        label="Move the copied fixtures onto the new drawing"
        checked={moveFixtures}
        onChange={(e) => setMoveFixtures(e.target.checked)}
      />
      <Button onClick={save} busy={align.isPending} disabled={old.length !== 2 || now.length !== 2}>
        Save the match
      </Button>
    </section>
  );
}
