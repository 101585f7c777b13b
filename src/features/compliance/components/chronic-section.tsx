import { useState, type FormEvent } from "react";
import { formatCalendarDay } from "#core/domain/dates/format-in-zone";
import type { SystemRecordsView } from "#core/contracts/compliance";
import { SourceText } from "../../../components/ui/source-text";
import { Button } from "../../../components/ui/button";
import { TextField } from "../../../components/ui/text-field";
import { formErrorMessage, serverFieldErrors } from "../../../lib/form-errors";
import { useRecordCharge } from "../api/record-charge";
import { AuditTrail } from "./audit-trail";
import type { NumberFormat } from "#core/domain/numbers/number-format";
import { formatMass, formatPercent, type MassUnit } from "../model/figures";

type Year = SystemRecordsView["chronic"][number];

/** "Filed on … by …": the member recording it signs for the report; the due item then closes. */
function FileReportForm({ systemId, year, today }: { systemId: string; year: number; today: string }) {
  const [filedOn, setFiledOn] = useState(today);
  const [reference, setReference] = useState("");
  const m = useRecordCharge();
  const fields = serverFieldErrors(m.error);
  const message = formErrorMessage(m.error);
  const submit = (e: FormEvent) => {
    e.preventDefault();
    m.mutate({ kind: "chronic-report", systemId, input: { year, filedOn, reference } });
  };
  return (
    <form
      onSubmit={submit}
      className="mt-2 grid gap-3 rounded-md bg-surface p-3 font-normal text-ink edge sm:grid-cols-3"
      aria-label={`Mark the ${year} report filed`}
    >
      {message && !Object.keys(fields).length ? <p className="text-danger sm:col-span-3">{message}</p> : null}
      <TextField
        label="Filed on"
        type="date"
        min={`${year + 1}-01-01`}
        max={today}
        value={filedOn}
        onChange={(e) => setFiledOn(e.target.value)}
        error={fields.filedOn ?? fields.year}
      />
      <TextField
        label="Reference (optional)"
        hint="The authority's receipt or submission number."
        value={reference}
        onChange={(e) => setReference(e.target.value)}
        error={fields.reference}
      />
      <div className="self-end">
        <Button type="submit" variant="secondary" busy={m.isPending}>
          Mark the {year} report filed
        </Button>
      </div>
      <p className="text-sm text-muted sm:col-span-3">You sign for this filing; it is kept in the audit trail below.</p>
    </form>
  );
}

/** Refrigerant added per calendar year, the chronic-leaker years and their reports. */
export function ChronicSection({
  r,
  unit,
  numberFormat,
  canFile,
}: {
  r: SystemRecordsView;
  unit: MassUnit;
  numberFormat: NumberFormat;
  canFile: boolean;
}) {
  if (r.chronic.length === 0 && r.audit.length === 0) return null;
  // No years to list (no leak-repair part in the profile, or nothing added): the audit trail alone.
  if (r.chronic.length === 0)
    return (
      <section aria-label="Audit trail" className="space-y-2">
        <AuditTrail r={r} />
      </section>
    );
  const fileable = (y: Year) => y.chronic && !y.filed && Number(r.today.slice(0, 4)) > y.year;
  return (
    <section aria-labelledby="chronic" className="space-y-2">
      <h2 id="chronic" className="text-xl font-bold">
        Added per calendar year
      </h2>
      <ul className="space-y-2">
        {r.chronic.map((y) => (
          <li key={y.year} className={y.chronic && !y.filed ? "font-bold text-danger" : undefined}>
            {y.noPart !== null ? (
              // Listed so the totals add up with the charge-added trail, not judged (docs/decisions/0127).
              <>
                {y.year}: {formatMass(y.notCountedKg, unit, numberFormat)} added — not counted: no leak-repair part
                applied to this system ({y.noPart})
              </>
            ) : (
              <>
                {y.year}: {formatMass(y.addedKg, unit, numberFormat)}, {formatPercent(y.percent, numberFormat)} of the
                full charge
                {y.notCountedKg > 0
                  ? `; ${formatMass(y.notCountedKg, unit, numberFormat)} more added while no leak-repair part applied (not counted)`
                  : ""}
              </>
            )}
            {y.chronic
              ? y.filed
                ? ` — chronic leaker; report filed on ${formatCalendarDay(y.filed.on)} by ${y.filed.by}${y.filed.reference ? ` (reference ${y.filed.reference})` : ""}`
                : ` — chronic leaker; report due ${formatCalendarDay(y.reportDue)}`
              : ""}
            {canFile && fileable(y) ? <FileReportForm systemId={r.system.id} year={y.year} today={r.today} /> : null}
          </li>
        ))}
      </ul>
      {r.chronicRule ? (
        <p className="text-sm text-muted">
          A system that takes {r.chronicRule.percent} % or more of its full charge in one calendar year is a chronic
          leaker, reported by {r.chronicRule.reportBy} (<SourceText source={r.chronicRule.source} />
          ).
        </p>
      ) : null}
      <AuditTrail r={r} />
    </section>
  );
}
