import { useState } from "react";
import { findingStateWords } from "#core/domain/findings/left-service";
import type { FindingStatus } from "#core/domain/findings/lifecycle";
import { formatCalendarDay } from "#core/domain/dates/format-in-zone";
import { Link } from "react-router";
import { COMPONENT_LABELS, type FINDING_COMPONENTS } from "#core/contracts/findings";
import type { TodayView as TodayData } from "#core/contracts/compliance";
import { DataTable, type Column } from "../../../components/ui/data-table";
import { EmptyState } from "../../../components/ui/empty-state";
import { Select } from "../../../components/ui/select";
import type { NumberFormat } from "#core/domain/numbers/number-format";
import { arrangeDue, daysInWords, DUE_KIND_LABELS, formatPercent, STATE_LABELS, type DueSort } from "../model/figures";
import { SourceText } from "../../../components/ui/source-text";

const STATE_TONE: Record<string, string> = {
  overdue: "text-danger font-bold",
  "due-today": "text-danger font-bold",
  "due-soon": "text-note font-bold",
  upcoming: "",
};

/**
 * The Today lists: what is due or overdue, systems over threshold, open findings, and every
 * system with its latest leak rate. Each figure links to the records beneath it; each deadline
 * names the rule it comes from.
 */
export function TodayView({
  data,
  storeId,
  onStoreChange,
  numberFormat,
}: {
  data: TodayData;
  /** The company's number format, for the leak rates. */
  numberFormat: NumberFormat;
  storeId: string | null;
  onStoreChange: (id: string | null) => void;
}) {
  const [sort, setSort] = useState<DueSort>("due");
  const due = arrangeDue(data.due, storeId, sort);
  // EU F-gas sets no leak-rate threshold: no over-threshold list, no rate or threshold columns.
  const eu = data.wording === "eu";
  const inStore = <T extends { storeId: string | null }>(rows: T[]) =>
    rows.filter((r) => storeId === null || r.storeId === storeId);
  return (
    <div className="space-y-8">
      <div className="flex flex-wrap gap-4">
        <Select
          label="Store"
          value={storeId ?? ""}
          onChange={(e) => onStoreChange(e.target.value || null)}
          options={[{ value: "", label: "All stores" }, ...data.stores.map((s) => ({ value: s.id, label: s.name }))]}
        />
        <Select
          label="Sort due items by"
          value={sort}
          onChange={(e) => setSort(e.target.value as DueSort)}
          options={[
            { value: "due", label: "Due date" },
            { value: "store", label: "Store" },
            { value: "kind", label: "Kind" },
          ]}
        />
      </div>

      <section aria-labelledby="due-heading" className="space-y-2">
        <h2 id="due-heading" className="text-xl font-bold">
          Due and overdue
        </h2>
        {due.length === 0 ? (
          <EmptyState title="Nothing is due">
            No repairs, verification tests, inspections or detector checks fall due.
          </EmptyState>
        ) : (
          <DataTable
            caption="Due and overdue"
            rows={due}
            rowKey={(r) => `${r.kind}-${r.systemId ?? r.detectorId}-${r.findingId ?? ""}-${r.dueOn}`}
            search="Search what is due"
            columns={[
              {
                header: "Due",
                sortValue: (r) => r.dueOn ?? "",
                filterValue: (r) => STATE_LABELS[r.state],
                cell: (r) => (
                  <span className={STATE_TONE[r.state]}>
                    {formatCalendarDay(r.dueOn ?? null)}
                    <br />
                    <span className="text-sm">
                      {STATE_LABELS[r.state]}, {daysInWords(r.daysLeft)}
                    </span>
                  </span>
                ),
              },
              {
                header: "What",
                searchText: (r) => `${DUE_KIND_LABELS[r.kind]} ${r.what}`,
                filterValue: (r) => DUE_KIND_LABELS[r.kind],
                cell: (r) => (
                  <>
                    <span className="text-sm text-muted">{DUE_KIND_LABELS[r.kind]}</span>
                    <br />
                    <Link className="text-accent underline" to={r.link}>
                      {r.what}
                    </Link>
                    <p className="mt-1 max-w-prose text-sm text-muted">
                      Rule: <SourceText source={r.source} />
                    </p>
                  </>
                ),
              },
              {
                header: "Where",
                searchText: (r) => `${r.storeName ?? "Company"} ${r.systemName ?? ""}`,
                sortValue: (r) => `${r.storeName ?? ""} ${r.systemName ?? ""}`,
                cell: (r) => (
                  <>
                    {r.storeName ?? "Company"}
                    {r.systemName ? (
                      <>
                        <br />
                        {r.systemName}
                      </>
                    ) : null}
                  </>
                ),
              },
            ]}
          />
        )}
      </section>

      <section aria-labelledby="over-heading" className="space-y-2" hidden={eu}>
        <h2 id="over-heading" className="text-xl font-bold">
          Systems over threshold
        </h2>
        {inStore(data.overThreshold).length === 0 ? (
          <p className="text-muted">No system has an unrepaired leak rate above its threshold.</p>
        ) : (
          <DataTable
            caption="Systems over threshold"
            rows={inStore(data.overThreshold)}
            rowKey={(r) => r.systemId}
            initialSort={{ header: "Leak rate", desc: true }}
            columns={[
              {
                header: "System",
                sortValue: (r) => r.systemName,
                cell: (r) => (
                  <Link className="text-accent underline" to={r.link}>
                    {r.systemName}
                  </Link>
                ),
              },
              { header: "Store", cell: (r) => r.storeName },
              {
                header: "Leak rate",
                sortValue: (r) => r.percent,
                cell: (r) => (
                  <Link className="font-bold text-danger underline" to={r.link}>
                    {formatPercent(r.percent, numberFormat)}
                  </Link>
                ),
              },
              { header: "Threshold", cell: (r) => `${r.thresholdPercent} %` },
              {
                header: "Calculated",
                cell: (r) => (
                  <>
                    {formatCalendarDay(r.on)}
                    <p className="max-w-xs text-sm text-muted">
                      <SourceText source={`${r.partTitle}; ${r.source}`} />
                    </p>
                  </>
                ),
              },
            ]}
          />
        )}
      </section>

      <section aria-labelledby="findings-heading" className="space-y-2">
        <h2 id="findings-heading" className="text-xl font-bold">
          Open findings
        </h2>
        {inStore(data.openFindings).length === 0 ? (
          <p className="text-muted">No open findings.</p>
        ) : (
          <DataTable
            caption="Open findings"
            rows={inStore(data.openFindings)}
            rowKey={(r) => r.id}
            search="Search open findings"
            columns={[
              {
                header: "Finding",
                searchText: (r) =>
                  `${r.component ? COMPONENT_LABELS[r.component as (typeof FINDING_COMPONENTS)[number]] : "Leak"} ${r.systemName ?? ""} ${r.storeName}`,
                cell: (r) => (
                  <Link className="text-accent underline" to={r.link}>
                    {r.component ? COMPONENT_LABELS[r.component as (typeof FINDING_COMPONENTS)[number]] : "Leak"} on{" "}
                    {r.systemName ?? "no system"}
                  </Link>
                ),
              },
              {
                header: "Status",
                cell: (r) =>
                  r.systemRetiredOn
                    ? findingStateWords({
                        status: r.status as FindingStatus,
                        events: [],
                        systemRetiredOn: r.systemRetiredOn,
                      })
                    : r.status === "verified"
                      ? "verified, ready to close"
                      : r.status,
                filterValue: (r) => r.status,
              },
              { header: "Store", cell: (r) => r.storeName },
              { header: "Found", cell: (r) => formatCalendarDay(r.foundOn), sortValue: (r) => r.foundOn },
              {
                header: "Deadline",
                sortValue: (r) => r.deadline ?? "",
                cell: (r) =>
                  r.deadline ? (
                    <>
                      <span className="font-bold">{r.deadline}</span>
                      <br />
                      <span className="block max-w-[13rem] text-sm text-muted">
                        <SourceText source={r.deadlineSource ?? ""} />
                      </span>
                    </>
                  ) : (
                    "—"
                  ),
              },
            ]}
          />
        )}
      </section>

      <section aria-labelledby="systems-heading" className="space-y-2">
        <h2 id="systems-heading" className="text-xl font-bold">
          Systems
        </h2>
        <DataTable
          caption={eu ? "Systems and their next leak check" : "Systems and their latest leak rate"}
          rows={inStore(data.systems)}
          rowKey={(r) => r.id}
          search="Search systems"
          columns={withoutRates<TodayData["systems"][number]>(eu, [
            {
              header: "System",
              sortValue: (r) => r.name,
              searchText: (r) => `${r.name} ${r.storeName} ${r.refrigerantName}`,
              cell: (r) => (
                <Link className="text-accent underline" to={r.link}>
                  {r.name}
                </Link>
              ),
            },
            { header: "Store", cell: (r) => r.storeName },
            { header: "Refrigerant", cell: (r) => r.refrigerantName, filterValue: (r) => r.refrigerantName },
            {
              header: "Latest leak rate",
              sortValue: (r) => r.latestPercent,
              cell: (r) =>
                r.latestPercent === null ? (
                  "no additions"
                ) : (
                  <>
                    <Link
                      className={`underline ${r.breachOpen ? "font-bold text-danger" : "text-accent"}`}
                      to={`${r.link}#leak-rates`}
                    >
                      {formatPercent(r.latestPercent, numberFormat)} on {r.latestOn}
                    </Link>
                    {r.repairedSince ? (
                      <span className="block text-sm text-muted">above the threshold; repaired since</span>
                    ) : null}
                  </>
                ),
            },
            {
              header: "Threshold",
              cell: (r) => (r.thresholdPercent === null ? "none applies" : `${r.thresholdPercent} %`),
            },
            {
              header: eu ? "Next leak check" : "Next inspection",
              sortValue: (r) => r.nextInspection ?? "",
              cell: (r) =>
                r.nextInspection ? (
                  <Link className="text-accent underline" to={`${r.link}#checks`}>
                    {formatCalendarDay(r.nextInspection)}
                  </Link>
                ) : (
                  "—"
                ),
            },
          ])}
        />
      </section>
    </div>
  );
}

/** Under EU F-gas the systems table has no leak-rate or threshold column (neither applies there). */
function withoutRates<Row>(eu: boolean, columns: Column<Row>[]): Column<Row>[] {
  return eu ? columns.filter((c) => c.header !== "Latest leak rate" && c.header !== "Threshold") : columns;
}
