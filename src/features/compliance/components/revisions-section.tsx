import { useState, type FormEvent } from "react";
import { formatCalendarDay } from "#core/domain/dates/format-in-zone";
import type { SystemRecordsView } from "#core/contracts/compliance";
import { APPLIANCE_TYPE_NAMES, APPLIANCE_TYPES, REVISION_KINDS } from "#core/contracts/systems";
import { Button } from "../../../components/ui/button";
import { Checkbox } from "../../../components/ui/checkbox";
import { DataTable } from "../../../components/ui/data-table";
import { QueryError } from "../../../components/ui/query-error";
import { Select } from "../../../components/ui/select";
import { TextField } from "../../../components/ui/text-field";
import { formErrorMessage, serverFieldErrors } from "../../../lib/form-errors";
import { useAddSystemRevision, useSystemRevisions } from "../api/system-revisions";
import { formatQuantity, type NumberFormat } from "#core/domain/numbers/number-format";
import { amountHint, readAmount } from "../model/amount-entry";
import { formatMass, type MassUnit } from "../model/figures";
import { kgToPounds } from "#core/domain/units/mass";
import { REFRIGERANTS } from "#core/domain/refrigerants/catalogue";

const KIND_NAMES: Record<string, string> = {
  first: "First values",
  change: "Change",
  correction: "Correction",
  retrofit: "Retrofit",
};

/**
 * The system's dated facts: each revision is in force from its day until the next one, and every
 * figure uses the values of its own date (docs/decisions/0043-system-revisions.md).
 */
export function RevisionsSection({
  r,
  unit,
  numberFormat,
  canRevise,
}: {
  r: SystemRecordsView;
  unit: MassUnit;
  numberFormat: NumberFormat;
  canRevise: boolean;
}) {
  const revisions = useSystemRevisions(r.system.id);
  return (
    <section id="revisions" aria-labelledby="revisions-heading" className="space-y-2">
      <h2 id="revisions-heading" className="text-xl font-bold">
        System history
      </h2>
      {revisions.isError ? (
        <QueryError error={revisions.error} what="the system's history" onRetry={() => void revisions.refetch()} />
      ) : null}
      {revisions.data ? (
        <DataTable
          caption="System history"
          rows={revisions.data.revisions}
          rowKey={(x) => x.id}
          columns={[
            { header: "From", cell: (x) => formatCalendarDay(x.effectiveFrom) },
            { header: "Kind", cell: (x) => KIND_NAMES[x.kind] ?? x.kind },
            { header: "Refrigerant", cell: (x) => x.refrigerantName },
            { header: "Full charge", cell: (x) => formatMass(x.fullChargeKg, unit, numberFormat) },
            { header: "Appliance", cell: (x) => APPLIANCE_TYPE_NAMES[x.applianceType] },
            { header: "Leak detection", cell: (x) => (x.automaticLeakDetection ? "Automatic" : "None") },
            { header: "In service", cell: (x) => (x.inServiceOn ? formatCalendarDay(x.inServiceOn) : "—") },
            { header: "Reason", cell: (x) => `${x.reason}${x.by ? ` (${x.by})` : ""}` },
          ]}
        />
      ) : null}
      {canRevise && !r.system.retired ? <RevisionForm r={r} unit={unit} numberFormat={numberFormat} /> : null}
    </section>
  );
}

function RevisionForm({ r, unit, numberFormat }: { r: SystemRecordsView; unit: MassUnit; numberFormat: NumberFormat }) {
  const s = r.system;
  const current = unit === "lb" ? kgToPounds(s.fullChargeKg) : s.fullChargeKg;
  const [effectiveFrom, setEffectiveFrom] = useState(r.today);
  const [kind, setKind] = useState<(typeof REVISION_KINDS)[number]>("change");
  const [reason, setReason] = useState("");
  const [refrigerantId, setRefrigerantId] = useState(s.refrigerantId);
  const initialCharge = formatQuantity(current, numberFormat, 3);
  const [charge, setCharge] = useState(initialCharge);
  const [chargeProblem, setChargeProblem] = useState<string | null>(null);
  const read = readAmount(charge, unit, numberFormat);
  const [applianceType, setApplianceType] = useState(s.applianceType);
  const [ald, setAld] = useState(s.automaticLeakDetection);
  const mutation = useAddSystemRevision({ onDone: () => setReason("") });
  const fields = serverFieldErrors(mutation.error);
  const submit = (e: FormEvent) => {
    e.preventDefault();
    // A charge left as it opened is not a change (re-reading a rounded figure must not move history).
    const changed = charge.trim() !== initialCharge;
    setChargeProblem(changed ? read.problem : null);
    if (changed && read.problem) return;
    // Only what changed is sent: the rest stays as it was on that day.
    mutation.mutate({
      systemId: s.id,
      input: {
        effectiveFrom,
        kind,
        reason,
        ...(refrigerantId.trim() !== s.refrigerantId ? { refrigerantId: refrigerantId.trim() } : {}),
        ...(changed ? { fullCharge: { value: read.value, unit } } : {}),
        ...(applianceType !== s.applianceType ? { applianceType } : {}),
        ...(ald !== s.automaticLeakDetection ? { automaticLeakDetection: ald } : {}),
      },
    });
  };
  const message = formErrorMessage(mutation.error);
  return (
    <form onSubmit={submit} className="grid gap-3 sm:grid-cols-2" aria-label="Record a change to the system">
      <p className="text-sm text-muted sm:col-span-2">
        A change takes effect on its day and leaves every earlier figure as it was. A new refrigerant is a retrofit.
      </p>
      {message ? <p className="text-danger sm:col-span-2">{message}</p> : null}
      <TextField
        label="In force from"
        type="date"
        max={r.today}
        value={effectiveFrom}
        onChange={(e) => setEffectiveFrom(e.target.value)}
        error={fields.effectiveFrom}
      />
      <Select
        label="Kind"
        value={kind}
        options={REVISION_KINDS.map((k) => ({ value: k, label: KIND_NAMES[k] }))}
        onChange={(e) => setKind(e.target.value as (typeof REVISION_KINDS)[number])}
        error={fields.kind}
      />
      <TextField
        label="Refrigerant"
        value={refrigerantId}
        onChange={(e) => setRefrigerantId(e.target.value)}
        error={fields.refrigerantId}
        // The catalogue's designations are offered as one types; a company's own refrigerant keeps its id.
        list="revision-refrigerants"
        hint="Its designation, e.g. R-448A"
      />
      <datalist id="revision-refrigerants">
        {REFRIGERANTS.map((x) => (
          <option key={x.id} value={x.id} />
        ))}
      </datalist>
      <TextField
        label={`Full charge (${unit})`}
        inputMode="decimal"
        value={charge}
        onChange={(e) => {
          setCharge(e.target.value);
          setChargeProblem(null);
        }}
        hint={amountHint(charge, read, numberFormat)}
        error={chargeProblem ?? fields["fullCharge.value"] ?? fields.fullCharge}
      />
      <Select
        label="Appliance type"
        value={applianceType}
        options={APPLIANCE_TYPES.map((t) => ({ value: t, label: APPLIANCE_TYPE_NAMES[t] }))}
        onChange={(e) => setApplianceType(e.target.value as typeof applianceType)}
        error={fields.applianceType}
      />
      <Checkbox label="Automatic leak detection" checked={ald} onChange={(e) => setAld(e.target.checked)} />
      <TextField
        label="Reason"
        value={reason}
        onChange={(e) => setReason(e.target.value)}
        error={fields.reason}
        className="sm:col-span-2"
      />
      <div>
        <Button type="submit" variant="secondary" busy={mutation.isPending}>
          Record the change
        </Button>
      </div>
    </form>
  );
}
