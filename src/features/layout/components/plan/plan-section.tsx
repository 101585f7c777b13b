import { useState } from "react";
import { Link } from "react-router";
import type { Plan } from "#core/contracts/plans";
import { formatLength, type LengthPreference } from "#core/domain/units/format-units";
import { Alert } from "../../../../components/ui/alert";
import { Button } from "../../../../components/ui/button";
import { EmptyState } from "../../../../components/ui/empty-state";
import { QueryError } from "../../../../components/ui/query-error";
import { Spinner } from "../../../../components/ui/spinner";
import { formatInZone } from "#core/domain/dates/format-in-zone";
import { usePlans } from "../../../../entities/plans/plans-api";
import { AlignmentPanel } from "./alignment-panel";
import { CalibrationPanel } from "./calibration-panel";
import { PlanUploadForm } from "./plan-upload-form";
import { ScaleBar } from "./scale-bar";

const THUMB_WIDTH = 320;

type Panel = "upload" | "calibrate" | "align" | null;

type DayFormat = (iso: string) => string;

/** The store page's plan: the current version, its scale, and the ways to change it. */
export function PlanSection({
  storeId,
  timeZone,
  canEdit,
  preference,
}: {
  storeId: string;
  /** The store's zone: a version's date is the store's day, whoever reads it. */
  timeZone: string;
  canEdit: boolean;
  preference: LengthPreference;
}) {
  const day = (iso: string) => formatInZone(iso, timeZone, "date");
  const plans = usePlans(storeId);
  const [panel, setPanel] = useState<Panel>(null);
  const [notice, setNotice] = useState<string | null>(null);
  const current = plans.data?.[0] ?? null;

  function after(plan: Plan, message: string | null = null) {
    setNotice(message);
    // A fresh upload needs its scale next; a fresh version then needs its match.
    if (plan.source === "image" && !plan.calibrated) setPanel("calibrate");
    else if (plan.previousPlanId && !plan.alignmentMatched && plan.image) setPanel("align");
    else setPanel(null);
  }

  return (
    <section aria-labelledby="plan-heading" className="space-y-3">
      <h2 id="plan-heading" className="text-xl font-bold">
        Floor plan
      </h2>
      {plans.isPending ? <Spinner label="Loading the plan…" /> : null}
      {plans.isError ? <QueryError error={plans.error} what="the plan" onRetry={() => void plans.refetch()} /> : null}
      {plans.data && !current ? (
        canEdit ? (
          <PlanUploadForm storeId={storeId} hasPlan={false} preference={preference} onDone={after} />
        ) : (
          <EmptyState title="No plan yet">A lead tech uploads the store's floor plan and maps its fixtures.</EmptyState>
        )
      ) : null}
      {current ? (
        <>
          {notice ? <Alert tone="success">{notice}</Alert> : null}
          <PlanCard plan={current} preference={preference} day={day} />
          <div className="flex flex-wrap gap-2">
            {current.calibrated ? (
              <Link
                to={`/stores/${storeId}/plans/${current.id}/layout`}
                className="inline-flex min-h-11 items-center rounded-md bg-accent px-4 py-2 font-bold text-on-accent no-underline edge border-accent hover:bg-accent-strong"
              >
                {canEdit ? "Open the layout editor" : "View the layout"}
              </Link>
            ) : null}
            {canEdit && current.image ? (
              <Button
                variant="secondary"
                aria-expanded={panel === "calibrate"}
                onClick={() => setPanel(panel === "calibrate" ? null : "calibrate")}
              >
                {current.calibrated ? "Re-calibrate the scale" : "Set the scale"}
              </Button>
            ) : null}
            {canEdit && current.previousPlanId && current.image ? (
              <Button
                variant="secondary"
                aria-expanded={panel === "align"}
                onClick={() => setPanel(panel === "align" ? null : "align")}
              >
                Match to the previous version
              </Button>
            ) : null}
            {canEdit ? (
              <Button
                variant="secondary"
                aria-expanded={panel === "upload"}
                onClick={() => setPanel(panel === "upload" ? null : "upload")}
              >
                Upload a new drawing
              </Button>
            ) : null}
          </div>
          {panel === "calibrate" && current.image ? (
            <CalibrationPanel key={current.id} plan={current} preference={preference} onDone={after} />
          ) : null}
          {panel === "align" ? (
            <AlignmentPanel
              key={current.id}
              plan={current}
              onDone={(p) => after(p, "The new version is matched to the previous one.")}
            />
          ) : null}
          {panel === "upload" ? (
            <PlanUploadForm
              storeId={storeId}
              hasPlan
              preference={preference}
              onDone={(p) => after(p, `Version ${p.version} is uploaded; the fixtures were copied onto it.`)}
            />
          ) : null}
          {plans.data && plans.data.length > 1 ? <VersionList plans={plans.data} day={day} /> : null}
        </>
      ) : null}
    </section>
  );
}

function PlanCard({ plan, preference, day }: { plan: Plan; preference: LengthPreference; day: DayFormat }) {
  const w = plan.widthM;
  const h = plan.heightM;
  const aspect = plan.image ? plan.image.heightPx / plan.image.widthPx : w && h ? h / w : 0.6;
  return (
    <div className="flex flex-wrap gap-4 rounded-md bg-surface p-4 edge">
      <div style={{ width: THUMB_WIDTH }} className="shrink-0">
        {plan.image ? (
          <img
            src={plan.image.thumbUrl}
            alt={`Floor plan, version ${plan.version}`}
            width={THUMB_WIDTH}
            height={Math.round(THUMB_WIDTH * aspect)}
            className="block w-full rounded edge"
          />
        ) : (
          <div
            role="img"
            aria-label={`Blank plan, version ${plan.version}`}
            className="w-full rounded bg-paper edge"
            style={{ height: Math.round(THUMB_WIDTH * aspect) }}
          />
        )}
        {w ? (
          <div className="mt-2">
            <ScaleBar metresPerScreenPixel={w / THUMB_WIDTH} preference={preference} maxPixels={140} />
          </div>
        ) : null}
      </div>
      <dl className="grid content-start gap-x-6 gap-y-1 sm:grid-cols-[max-content_1fr]">
        <dt className="font-bold">Version</dt>
        <dd>
          {plan.version} {plan.source === "blank" ? "(blank plan)" : "(drawing)"}, from {day(plan.createdAt)}
        </dd>
        <dt className="font-bold">Scale</dt>
        <dd>
          {plan.source === "blank" ? (
            "Drawn to size"
          ) : plan.calibrated && plan.metresPerPixel ? (
            `Calibrated: ${(plan.metresPerPixel * 100).toFixed(3)} cm per pixel`
          ) : (
            <span className="font-bold text-note">Not calibrated yet — set the scale before drawing fixtures</span>
          )}
        </dd>
        {w && h ? (
          <>
            <dt className="font-bold">Size</dt>
            <dd>
              {formatLength(w, preference, { decimals: 1 })} × {formatLength(h, preference, { decimals: 1 })}
            </dd>
          </>
        ) : null}
        <dt className="font-bold">Fixtures</dt>
        <dd>{plan.fixtureCount}</dd>
        {plan.previousPlanId ? (
          <>
            <dt className="font-bold">Match to previous</dt>
            <dd>
              {plan.alignmentMatched ? (
                "Matched by two points"
              ) : (
                <span className="font-bold text-note">Not matched yet</span>
              )}
            </dd>
          </>
        ) : null}
      </dl>
      {plan.source === "image" && !plan.calibrated ? (
        <div className="w-full">
          <Alert tone="note">Fixtures are stored in metres, so the drawing needs its scale first.</Alert>
        </div>
      ) : null}
    </div>
  );
}

function VersionList({ plans, day }: { plans: readonly Plan[]; day: DayFormat }) {
  return (
    <details className="rounded-md bg-surface p-4 edge">
      <summary className="min-h-11 cursor-pointer py-2 font-bold">All plan versions ({plans.length})</summary>
      <ul className="mt-2 space-y-1">
        {plans.map((p) => (
          <li key={p.id}>
            Version {p.version}: {p.source === "blank" ? "blank plan" : "drawing"}, {day(p.createdAt)}, {p.fixtureCount}{" "}
            fixtures
            {p.calibrated ? "" : ", not calibrated"}
            {p === plans[0] ? " — current" : ""}
          </li>
        ))}
      </ul>
    </details>
  );
}
