import { useEffect, useRef, useState, type FormEvent } from "react";
import type { Plan } from "#core/contracts/plans";
import { formatLength, type LengthPreference } from "#core/domain/units/format-units";
import { Alert } from "../../../../components/ui/alert";
import { Button } from "../../../../components/ui/button";
import { TextField } from "../../../../components/ui/text-field";
import { fieldMessage, formErrorMessage, serverFieldErrors } from "../../../../lib/form-errors";
import { useCalibratePlan } from "../../api/calibrate-plan";
import { metresPerPixelFromLine } from "../../model/calibration";
import { pixelScaleText } from "../../model/scale-readout";
import type { ImagePoint } from "../../../../lib/plan-view/coordinates";
import { readLengthEntry } from "../../model/length-entry";
import { ImagePointPicker } from "./image-point-picker";

const OUTCOME_TEXT = {
  first: "The plan's scale is set.",
  rescaled: "The scale is updated and the fixtures were rescaled with it.",
  "new-version":
    "Sweeps exist on this plan, so a new plan version holds the new scale; the old sweeps stay where they were.",
} as const;

/** Draw a line between two points of known distance on the drawing and type that distance. */
export function CalibrationPanel({
  plan,
  preference,
  onDone,
}: {
  plan: Plan;
  preference: LengthPreference;
  onDone: (plan: Plan, notice: string) => void;
}) {
  const image = plan.image!;
  const [points, setPoints] = useState<ImagePoint[]>(() =>
    plan.calibration ? [plan.calibration.a as ImagePoint, plan.calibration.b as ImagePoint] : [],
  );
  const [text, setText] = useState(() =>
    plan.calibration ? `${plan.calibration.length.value}${plan.calibration.length.unit === "ft" ? " ft" : " m"}` : "",
  );
  const [lengthError, setLengthError] = useState<string | undefined>();
  const calibrate = useCalibratePlan();
  const form = useRef<HTMLFormElement>(null);
  // The panel opens below the plan card (often after an upload): bring it into view.
  useEffect(() => {
    form.current?.scrollIntoView({ block: "start", behavior: "smooth" });
  }, []);

  const entry = readLengthEntry(text, preference);
  let preview: string | null = null;
  if (points.length === 2 && entry.ok) {
    try {
      const mpp = metresPerPixelFromLine(points[0], points[1], entry.length);
      preview = `${pixelScaleText(mpp, preference)}; the drawing is ${formatLength(mpp * image.widthPx, preference, { decimals: 1 })} × ${formatLength(mpp * image.heightPx, preference, { decimals: 1 })}.`;
    } catch (e) {
      preview = e instanceof RangeError ? e.message : null;
    }
  }

  function submit(e: FormEvent) {
    e.preventDefault();
    if (!entry.ok) {
      setLengthError(entry.message);
      return;
    }
    setLengthError(undefined);
    if (points.length !== 2) return;
    calibrate.mutate(
      {
        planId: plan.id,
        input: { a: points[0], b: points[1], length: entry.length, layoutRevision: plan.layoutRevision },
      },
      {
        onSuccess: (r) => onDone(r.plan, OUTCOME_TEXT[r.outcome]),
      },
    );
  }

  const fields = serverFieldErrors(calibrate.error);
  const pointError = fields.a ?? fields.b;
  const formError = formErrorMessage(calibrate.error);
  return (
    <form ref={form} onSubmit={submit} noValidate className="space-y-3 rounded-md bg-surface p-4 edge">
      <h3 className="text-lg font-bold">Set the scale</h3>
      <p className="max-w-prose">
        Click both ends of something whose length you know, as long as possible — a wall, a row of cases — then type its
        real length. Feet and inches are fine: <code>42 ft 6 in</code>.
      </p>
      {formError ? <Alert tone="error">{formError}</Alert> : null}
      <ImagePointPicker
        imageUrl={image.displayUrl}
        widthPx={image.widthPx}
        heightPx={image.heightPx}
        points={points}
        onChange={setPoints}
        names={["A", "B"]}
        label="Calibration line on the drawing"
      />
      {pointError ? <p className="font-bold text-danger">{fieldMessage("The line's end", pointError)}</p> : null}
      {points.length === 2 ? (
        <p className="text-sm">
          Line A–B: {Math.hypot(points[1].x - points[0].x, points[1].y - points[0].y).toFixed(1)} px on the drawing.
        </p>
      ) : null}
      <TextField
        label="Real length of the line"
        hint={
          preference === "ft-in"
            ? "In feet unless you type a unit (e.g. 40, 40 ft 6 in, 12.3 m)"
            : "In metres unless you type a unit (e.g. 12.5, 41 ft)"
        }
        value={text}
        onChange={(e) => setText(e.target.value)}
        error={lengthError ?? fields["length.value"]}
        className="max-w-sm"
      />
      {preview ? <p className="text-sm text-muted">{preview}</p> : null}
      <Button type="submit" busy={calibrate.isPending} disabled={points.length !== 2}>
        Save scale
      </Button>
    </form>
  );
}
