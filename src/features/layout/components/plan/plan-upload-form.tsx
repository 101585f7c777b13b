import { useId, useState, type FormEvent } from "react";
import type { Plan } from "#core/contracts/plans";
import type { LengthPreference } from "#core/domain/units/format-units";
import { Alert } from "../../../../components/ui/alert";
import { Button } from "../../../../components/ui/button";
import { TextField } from "../../../../components/ui/text-field";
import { formatBytes } from "../../../../lib/format";
import { formErrorMessage, serverFieldErrors } from "../../../../lib/form-errors";
import { useCreateBlankPlan } from "../../api/create-blank-plan";
import { PLAN_IMAGE_TYPES, useUploadPlan } from "../../api/upload-plan";
import { uploadStatusText } from "../../model/upload-status";
import type { UploadProgress } from "../../../../lib/upload-with-progress";
import { readLengthEntry } from "../../model/length-entry";
import { toMetres } from "#core/analysis/geometry/units";

/** Upload a drawing (PNG or JPEG), or start from a blank plan of a given size. */
export function PlanUploadForm({
  storeId,
  hasPlan,
  preference,
  onDone,
}: {
  storeId: string;
  hasPlan: boolean;
  preference: LengthPreference;
  onDone: (plan: Plan) => void;
}) {
  const fileId = useId();
  const [file, setFile] = useState<File | null>(null);
  const [typeError, setTypeError] = useState<string | null>(null);
  const upload = useUploadPlan();
  const [progress, setProgress] = useState<UploadProgress | null>(null);

  function submit(e: FormEvent) {
    e.preventDefault();
    if (!file) {
      setTypeError("Choose a PNG or JPEG file first.");
      return;
    }
    if (upload.isPending) return; // one upload at a time
    upload.mutate(
      { storeId, file, onProgress: setProgress },
      { onSuccess: (saved) => onDone(saved), onSettled: () => setProgress(null) },
    );
  }

  function pick(f: File | null) {
    setFile(f);
    upload.reset();
    setTypeError(
      f && !(PLAN_IMAGE_TYPES as readonly string[]).includes(f.type)
        ? `“${f.name}” does not look like a PNG or JPEG; the server will check its content.`
        : null,
    );
  }

  const uploadError = formErrorMessage(upload.error);
  return (
    <div className="grid gap-4 lg:grid-cols-2">
      <form
        onSubmit={submit}
        noValidate
        aria-busy={upload.isPending}
        className="space-y-3 rounded-md bg-surface p-4 edge"
      >
        <h3 className="text-lg font-bold">{hasPlan ? "Upload a new drawing" : "Upload the floor plan"}</h3>
        <p className="text-muted">
          A PNG or JPEG of up to 25 MB.
          {hasPlan
            ? " It becomes a new plan version: the fixtures are copied onto it and the old version and its sweeps stay as they are."
            : ""}
        </p>
        <div>
          <label htmlFor={fileId} className="block font-bold">
            Drawing file
          </label>
          <input
            id={fileId}
            type="file"
            accept="image/png,image/jpeg"
            onChange={(e) => pick(e.target.files?.[0] ?? null)}
            className="mt-1 block min-h-11 w-full rounded-md bg-surface px-3 py-2 edge file:mr-3 file:min-h-9 file:rounded-md file:border-0 file:bg-accent-soft file:px-3 file:font-bold"
          />
          {file ? (
            <p className="text-sm text-muted">
              {file.name}, {formatBytes(file.size)}
            </p>
          ) : null}
        </div>
        {typeError ? <Alert tone="note">{typeError}</Alert> : null}
        {uploadError ? (
          <Alert tone="error" title="The drawing was not accepted">
            {uploadError}
          </Alert>
        ) : null}
        <Button type="submit" busy={upload.isPending}>
          Upload drawing
        </Button>
        <div role="status" aria-live="polite" data-testid="plan-upload-status">
          {progress ? (
            <div className="space-y-1">
              <p className="font-bold">{uploadStatusText(progress)}</p>
              {/* A bar that fills while bytes go up, then moves without a value while the server works. */}
              <progress
                className="h-3 w-full"
                aria-label="Upload progress"
                max={1}
                value={progress.stage === "uploading" && progress.fraction !== null ? progress.fraction : undefined}
              />
            </div>
          ) : null}
        </div>
      </form>
      {hasPlan ? null : <BlankPlanForm storeId={storeId} preference={preference} onDone={onDone} />}
    </div>
  );
}

function BlankPlanForm({
  storeId,
  preference,
  onDone,
}: {
  storeId: string;
  preference: LengthPreference;
  onDone: (plan: Plan) => void;
}) {
  const [width, setWidth] = useState("");
  const [depth, setDepth] = useState("");
  const [errors, setErrors] = useState<Record<string, string>>({});
  const create = useCreateBlankPlan();
  const server = serverFieldErrors(create.error);

  function submit(e: FormEvent) {
    e.preventDefault();
    const w = readLengthEntry(width, preference);
    const d = readLengthEntry(depth, preference);
    const next: Record<string, string> = {};
    if (!w.ok) next.width = w.message;
    if (!d.ok) next.depth = d.message;
    setErrors(next);
    if (!w.ok || !d.ok) return;
    // One unit for both sides: metres, unless both were typed as bare feet.
    const same = w.length.unit === d.length.unit;
    const input = same
      ? { width: w.length.value, depth: d.length.value, unit: w.length.unit }
      : {
          width: toMetres(w.length.value, w.length.unit),
          depth: toMetres(d.length.value, d.length.unit),
          unit: "m" as const,
        };
    create.mutate({ storeId, input }, { onSuccess: (saved) => onDone(saved) });
  }

  const unitWord = preference === "ft-in" ? "feet" : "metres";
  const formError = formErrorMessage(create.error);
  return (
    <form onSubmit={submit} noValidate className="space-y-3 rounded-md bg-surface p-4 edge">
      <h3 className="text-lg font-bold">Or start from a blank plan</h3>
      <p className="text-muted">
        When there is no drawing: give the sales floor's width and depth ({unitWord} unless you type a unit) and draw
        the fixtures on a grid.
      </p>
      {formError ? <Alert tone="error">{formError}</Alert> : null}
      <div className="flex flex-wrap gap-3">
        <TextField
          label="Width"
          value={width}
          onChange={(e) => setWidth(e.target.value)}
          error={errors.width ?? server.width}
          className="w-40"
        />
        <TextField
          label="Depth"
          value={depth}
          onChange={(e) => setDepth(e.target.value)}
          error={errors.depth ?? server.depth}
          className="w-40"
        />
      </div>
      <Button type="submit" variant="secondary" busy={create.isPending}>
        Create blank plan
      </Button>
    </form>
  );
}
