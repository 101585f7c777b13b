import { useState } from "react";
import { formatCalendarDay, formatInZone } from "#core/domain/dates/format-in-zone";
import { statementTitle } from "#core/domain/compliance/company-profile";
import { Link } from "react-router";
import { EXCLUSION_NAMES, type SystemRecordsView } from "#core/contracts/compliance";
import { APPLIANCE_TYPE_NAMES } from "#core/contracts/systems";
import { Button } from "../../../components/ui/button";
import { Cautions } from "../../../components/ui/cautions";
import { DataTable } from "../../../components/ui/data-table";
import { TextField } from "../../../components/ui/text-field";
import { serverFieldErrors } from "../../../lib/form-errors";
import { useRecordCharge } from "../api/record-charge";
import { formatGrouped, formatQuantity, type NumberFormat } from "#core/domain/numbers/number-format";
import { daysInWords, formatMass, formatPercent, STATE_LABELS, type MassUnit } from "../model/figures";
import { ChargeForm } from "./charge-form";
import { ChronicSection } from "./chronic-section";
import { SystemPlots } from "./system-plots";
import { RevisionsSection } from "./revisions-section";
import { LeakCheckForm } from "./leak-check-form";
import { LeakDetectionChecks } from "./leak-detection-checks";
import { retireReasonWords } from "#core/domain/compliance/retirement-words";
import { readableSource } from "#core/domain/compliance/citations";
import { Readable, SourceText } from "../../../components/ui/source-text";

function Fact({ label, children }: { label: string; children: React.ReactNode }) {
  return (
    <div className="rounded-md bg-surface p-3 edge">
      <dt className="text-sm text-muted">{label}</dt>
      <dd className="font-bold">{children}</dd>
    </div>
  );
}

function VoidForm({ id, onDone }: { id: string; onDone: () => void }) {
  const [reason, setReason] = useState("");
  const m = useRecordCharge({ onDone });
  return (
    <form
      className="flex flex-wrap items-end gap-2"
      onSubmit={(e) => {
        e.preventDefault();
        m.mutate({ kind: "void", additionId: id, input: { voidReason: reason } });
      }}
    >
      <TextField
        label="Why void this entry"
        value={reason}
        onChange={(e) => setReason(e.target.value)}
        error={serverFieldErrors(m.error).voidReason}
      />
      <Button type="submit" variant="danger" busy={m.isPending}>
        Void the entry
      </Button>
    </form>
  );
}

/**
 * A system's records: what applies and why, the leak rate at every addition against the
 * threshold, due dates with their rules, the charge-added audit trail and the exports.
 */
export function SystemRecords({
  r,
  unit,
  numberFormat,
  canRecord,
  canFile = false,
  findings,
}: {
  r: SystemRecordsView;
  unit: MassUnit;
  /** The company's number format: every figure here is written in it. */
  numberFormat: NumberFormat;
  canRecord: boolean;
  canFile?: boolean;
  findings: { id: string; label: string }[];
}) {
  const [editing, setEditing] = useState<{ id: string; mode: "correct" | "void" } | null>(null);
  const byId = new Map(r.additions.map((a) => [a.id, a]));
  const a = r.applicability;
  const eu = r.profile.wording === "eu";
  // A retired system takes no new entry or change; corrections of its entries stay possible (decision 0040).
  const retired = r.system.retired !== null;
  const mass = (kg: number) => formatMass(kg, unit, numberFormat);
  const percent = (p: number) => formatPercent(p, numberFormat);
  const gwp = (v: number) => formatGrouped(v, numberFormat, 0);
  // The amount as it was typed, with all its places, in the company's marks ("8,5", never "8.5").
  const asEntered = (v: number) => formatGrouped(v, numberFormat, Math.min(6, (String(v).split(".")[1] ?? "").length));
  return (
    <div className="space-y-8">
      <dl className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
        <Fact label="Refrigerant">
          {r.system.refrigerant.designation}
          {r.system.refrigerant.enteredByCompany ? " (entered by the company)" : ""} · class{" "}
          {r.system.refrigerant.safetyClass}
          {r.system.refrigerant.gwp ? ` · GWP ${gwp(r.system.refrigerant.gwp.value)}` : ""}
        </Fact>
        <Fact label="Full charge">{mass(r.system.fullChargeKg)}</Fact>
        <Fact label="Latest leak rate">
          {r.latest ? (
            <span className={r.latest.exceeds ? "text-danger" : ""}>
              {percent(r.latest.percent)} on {formatCalendarDay(r.latest.date)}
            </span>
          ) : !r.profile.leakRateRules && r.additions.length > 0 ? (
            // EU F-gas sets no leak-rate rule: the additions are listed, not turned into a rate.
            "Not calculated under this profile"
          ) : (
            "No additions yet"
          )}
        </Fact>
        <Fact label="Threshold">
          {a.thresholdPercent === null ? "None applies" : `${a.thresholdPercent} % per year`}
        </Fact>
        <Fact label="CO2-equivalent">
          {r.co2e.known && r.co2e.tonnes !== null
            ? `${formatQuantity(r.co2e.tonnes, numberFormat)} t (GWP ${r.co2e.gwp === null ? "unknown" : gwp(r.co2e.gwp)})`
            : "Unknown"}
          {r.system.refrigerant.gwp ? (
            <span className="block text-sm text-muted">GWP basis: {r.system.refrigerant.gwp.statement}</span>
          ) : null}
        </Fact>
        <Fact label={eu ? "Next leak check" : "Next inspection"}>
          {r.nextInspection ? formatCalendarDay(r.nextInspection.dueOn) : "None scheduled"}
        </Fact>
        <Fact label="Appliance">{APPLIANCE_TYPE_NAMES[r.system.applianceType]}</Fact>
        <Fact label="Leak detection">
          {r.system.automaticLeakDetection ? "Automatic" : "None"}
          {r.automaticLeakDetection?.required ? (
            <span className={r.system.automaticLeakDetection ? "block text-sm" : "block text-sm text-danger"}>
              Required
              {r.automaticLeakDetection.dueOn ? ` by ${formatCalendarDay(r.automaticLeakDetection.dueOn)}` : ""} (
              <SourceText source={r.automaticLeakDetection.source} />)
            </span>
          ) : null}
        </Fact>
        {eu || r.system.hermeticallySealed ? (
          <Fact label="Hermetically sealed">
            {r.system.hermeticallySealed ? "Yes: factory-sealed, labelled as such" : "No"}
          </Fact>
        ) : null}
      </dl>
      <div className="space-y-1 text-sm text-muted">
        <p>
          <span className="font-bold text-ink">Rule: </span>
          {a.applies ? (
            <Readable text={`${a.reason}. Threshold source: ${readableSource(a.thresholdSource ?? "")}.`} />
          ) : (
            `No leak-rate threshold: ${a.reason}.`
          )}
        </p>
        <p>
          <span className="font-bold text-ink">Profile: </span>
          {r.profile.name}
          {r.profile.leakRateRules
            ? `, ${r.profile.method === "annualizing" ? "annualizing method" : "rolling-average method"} (40 CFR 82.152 / 84.102)`
            : ""}
          . Records are kept {r.profile.retentionYears} years (<SourceText source={r.profile.retentionSource} />
          ).
        </p>
        {r.system.retired ? (
          <p>
            <span className="font-bold text-ink">Retired: </span>
            left service on {formatCalendarDay(r.system.retired.on)}
            {retireReasonWords(r.system.retired) ? ` (${retireReasonWords(r.system.retired)})` : ""}. Its records stay
            as they are
            {r.retention.keptUntil ? ` and are kept at least until ${formatCalendarDay(r.retention.keptUntil)}` : ""}.
          </p>
        ) : null}
        {r.leakCheck ? (
          <p>
            <span className="font-bold text-ink">Leak checks: </span>
            {r.leakCheck.reason}.
            {r.leakCheck.withoutLdsMonths !== null && r.leakCheck.withLdsMonths !== null
              ? ` Without a leak detection system every ${r.leakCheck.withoutLdsMonths} months; with one every ${r.leakCheck.withLdsMonths} months.`
              : ""}
          </p>
        ) : null}
        {r.nextInspection ? (
          <p>
            <span className="font-bold text-ink">{eu ? "Next leak check" : "Next inspection"}: </span>
            {r.nextInspection.reason} (<SourceText source={r.nextInspection.source} />
            ).
          </p>
        ) : null}
      </div>

      {r.due.length ? (
        <section aria-labelledby="sys-due" className="space-y-2">
          <h2 id="sys-due" className="text-xl font-bold">
            Due
          </h2>
          <ul className="space-y-2">
            {r.due.map((d) => (
              <li key={`${d.kind}-${d.dueOn}-${d.findingId}`} className="rounded-md bg-surface p-3 edge">
                <span className="font-bold">{formatCalendarDay(d.dueOn)}</span> · {STATE_LABELS[d.state]},{" "}
                {daysInWords(d.daysLeft)} ·{" "}
                {d.findingId ? (
                  <Link className="text-accent underline" to={d.link}>
                    {d.what}
                  </Link>
                ) : (
                  d.what
                )}
                <p className="text-sm text-muted">
                  Rule: <SourceText source={d.source} />
                </p>
              </li>
            ))}
          </ul>
        </section>
      ) : null}

      <SystemPlots r={r} unit={unit} numberFormat={numberFormat} />

      <section id="leak-rates" aria-labelledby="rates" className="space-y-2">
        <h2 id="rates" className="text-xl font-bold">
          {r.profile.leakRateRules ? "Leak rate at every addition" : "Leak rate"}
        </h2>
        {!r.profile.leakRateRules ? (
          <p className="text-muted">
            {r.profile.name} sets leak-check intervals by CO2-equivalent, not a leak-rate threshold: refrigerant added
            is listed below.
          </p>
        ) : r.leakRates.length === 0 ? (
          <p className="text-muted">
            {r.additions.some((x) => !x.voided)
              ? "No leak-rate figure: the refrigerant added was excluded from the calculation."
              : "No refrigerant has been added: no leak rate yet."}
          </p>
        ) : (
          <DataTable
            caption="Leak rate at every addition"
            rows={r.leakRates}
            rowKey={(p) => p.date}
            columns={[
              { header: "Date", cell: (p) => formatCalendarDay(p.date), sortValue: (p) => p.date },
              {
                header: "Added",
                cell: (p) => mass(p.additionIds.reduce((s, id) => s + (byId.get(id)?.amountKg ?? 0), 0)),
              },
              {
                header: p0(r),
                cell: (p) =>
                  p.method === "annualizing"
                    ? `${p.days} days`
                    : `${formatCalendarDay(p.windowStart)} to ${formatCalendarDay(p.date)}`,
              },
              { header: "Counted", cell: (p) => mass(p.countedKg) },
              {
                header: "Leak rate",
                sortValue: (p) => p.percent,
                filterValue: (p) => (p.exceeds ? "above the threshold" : "within the threshold"),
                cell: (p) => (
                  <span className={p.exceeds ? "font-bold text-danger" : ""}>
                    {percent(p.percent)}
                    {p.exceeds ? " — above threshold" : ""}
                  </span>
                ),
              },
              {
                header: "Threshold",
                // Each figure cites the part in force on its own date: after a retrofit, earlier figures keep theirs.
                cell: (p) =>
                  p.thresholdPercent === null ? (
                    "none"
                  ) : (
                    <>
                      {p.thresholdPercent} %
                      {p.thresholdSource ? (
                        <span className="block text-sm text-muted">
                          <SourceText source={p.thresholdSource} />
                        </span>
                      ) : null}
                    </>
                  ),
              },
              { header: "Repair due", cell: (p) => (p.repairDue ? formatCalendarDay(p.repairDue) : "") },
            ]}
          />
        )}
      </section>

      <ChronicSection r={r} unit={unit} numberFormat={numberFormat} canFile={canFile} />
      <RevisionsSection r={r} unit={unit} numberFormat={numberFormat} canRevise={canFile && !retired} />

      <section aria-labelledby="charge" className="space-y-3">
        <h2 id="charge" className="text-xl font-bold">
          Charge added
        </h2>
        {canRecord && !retired ? (
          <ChargeForm
            systemId={r.system.id}
            today={r.today}
            unit={unit}
            numberFormat={numberFormat}
            findings={findings}
          />
        ) : null}
        <DataTable
          caption="Charge-added entries, voided ones kept"
          rows={[...r.additions].reverse()}
          rowKey={(x) => x.id}
          search="Search charge added"
          columns={[
            {
              header: "Date",
              cell: (x) => (x.voided ? <s>{formatCalendarDay(x.addedOn)}</s> : formatCalendarDay(x.addedOn)),
              sortValue: (x) => x.addedOn,
            },
            {
              header: "Amount",
              sortValue: (x) => x.amountKg,
              cell: (x) => (
                <>
                  {x.voided ? <s>{mass(x.amountKg)}</s> : mass(x.amountKg)}
                  <br />
                  <span className="text-sm text-muted">
                    entered {asEntered(x.enteredValue)} {x.enteredUnit}
                    {x.excluded ? `; not counted: ${EXCLUSION_NAMES[x.excluded]}` : ""}
                  </span>
                </>
              ),
            },
            {
              header: "Technician",
              cell: (x) => x.technician,
              searchText: (x) => x.technician,
              filterValue: (x) => x.technician,
            },
            {
              header: "Reason",
              searchText: (x) => x.reason,
              cell: (x) => (
                <>
                  {x.reason}
                  {x.findingId ? (
                    <>
                      <br />
                      <Link className="text-sm text-accent underline" to={`/findings/${x.findingId}`}>
                        linked finding
                      </Link>
                    </>
                  ) : null}
                </>
              ),
            },
            {
              header: "Audit",
              filterValue: (x) => (x.voided ? "voided" : "in force"),
              searchText: (x) =>
                x.voided ? `voided ${x.voided.by} ${x.voided.reason}` : `recorded by ${x.recordedBy}`,
              cell: (x) =>
                x.voided ? (
                  <span className="text-sm">
                    Voided {formatInZone(x.voided.at, r.store.timeZone, "date")} by {x.voided.by}: {x.voided.reason}
                    {x.voided.byEntryId ? " (corrected)" : ""}
                  </span>
                ) : (
                  <span className="text-sm text-muted">
                    Recorded by {x.recordedBy}
                    {x.correctsId ? " as a correction" : ""}
                  </span>
                ),
            },
            {
              header: "",
              cell: (x) =>
                canRecord && !x.voided ? (
                  <div className="flex gap-1">
                    <Button variant="quiet" onClick={() => setEditing({ id: x.id, mode: "correct" })}>
                      Correct
                    </Button>
                    <Button variant="quiet" onClick={() => setEditing({ id: x.id, mode: "void" })}>
                      Void
                    </Button>
                  </div>
                ) : null,
            },
          ]}
          rowDetail={(x) =>
            editing?.id === x.id ? (
              editing.mode === "correct" ? (
                <ChargeForm
                  systemId={r.system.id}
                  today={r.today}
                  unit={unit}
                  numberFormat={numberFormat}
                  findings={findings}
                  corrects={{ id: x.id, addedOn: x.addedOn, excluded: x.excluded }}
                  onDone={() => setEditing(null)}
                />
              ) : (
                <VoidForm id={x.id} onDone={() => setEditing(null)} />
              )
            ) : null
          }
        />
      </section>

      <section aria-labelledby="checks" className="space-y-3">
        <h2 id="checks" className="text-xl font-bold">
          {eu ? "Leak checks" : "Leak checks and inspections"}
        </h2>
        {canRecord && !retired ? <LeakCheckForm systemId={r.system.id} today={r.today} /> : null}
        {r.leakChecks.length === 0 ? (
          <p className="text-muted">No leak check recorded.</p>
        ) : (
          <ul className="space-y-1">
            {r.leakChecks.map((c) => (
              <li key={c.id}>
                {formatCalendarDay(c.checkedOn)}: {c.leakFound ? "leak found" : "no leak found"} — {c.by}
                {c.note ? ` (${c.note})` : ""}
              </li>
            ))}
          </ul>
        )}
      </section>

      <LeakDetectionChecks r={r} canRecord={canRecord && !retired} />

      <section aria-labelledby="exports" className="space-y-2">
        <h2 id="exports" className="text-xl font-bold">
          Records export
        </h2>
        <p className="flex flex-wrap gap-4">
          <a
            className="text-accent underline"
            href={`/api/systems/${r.system.id}/leak-rate-statement.pdf`}
            target="_blank"
            rel="noreferrer"
          >
            {statementTitle(r.profile.leakRateRules)} (PDF)
          </a>
          <a className="text-accent underline" href={`/api/systems/${r.system.id}/records.csv`}>
            Charge added and findings (CSV)
          </a>
        </p>
      </section>

      <Cautions items={r.cautions} />
    </div>
  );
}

function p0(r: SystemRecordsView): string {
  return r.profile.method === "annualizing" ? "Days counted" : "Window";
}
