import type { DueItem } from "#core/contracts/compliance";
import { KG_PER_POUND } from "#core/domain/units/mass";
import { formatGrouped, type NumberFormat } from "#core/domain/numbers/number-format";

export type MassUnit = "kg" | "lb";

/**
 * A mass in the reader's unit, from kg as stored (1 lb = 0.45359237 kg exactly, NIST SP 811),
 * grouped in the company's number format: "1,500.0 lb", "680,39 kg".
 */
export function formatMass(kg: number, unit: MassUnit, format: NumberFormat): string {
  return unit === "lb" ? `${formatGrouped(kg / KG_PER_POUND, format, 1)} lb` : `${formatGrouped(kg, format, 2)} kg`;
}

export function formatPercent(p: number, format: NumberFormat): string {
  return `${formatGrouped(p, format, 1)} %`;
}

export const STATE_LABELS: Record<DueItem["state"], string> = {
  overdue: "Overdue",
  "due-today": "Due today",
  "due-soon": "Due soon",
  upcoming: "Upcoming",
};

export const DUE_KIND_LABELS: Record<DueItem["kind"], string> = {
  repair: "Repair",
  "initial-test": "Initial verification test",
  "follow-up-test": "Follow-up verification test",
  "recheck-after-repair": "Re-check",
  inspection: "Inspection",
  "chronic-leaker-report": "Report",
  "detector-check": "Detector check",
  "automatic-leak-detection": "Leak detection",
  "leak-detection-check": "Detection system check",
  "retrofit-or-retire-plan": "Retrofit-or-retire plan",
  "retrofit-or-retire": "Retrofit or retire",
};

export type DueSort = "due" | "store" | "kind";

/** In words: "in 3 days", "today", "5 days late". */
export function daysInWords(daysLeft: number | null): string {
  if (daysLeft === null) return "never recorded";
  if (daysLeft === 0) return "today";
  if (daysLeft < 0) return `${-daysLeft} day${daysLeft === -1 ? "" : "s"} late`;
  return `in ${daysLeft} day${daysLeft === 1 ? "" : "s"}`;
}

/** Filters by store (null: all) and sorts the due list; undated items count as most urgent. */
export function arrangeDue(items: readonly DueItem[], storeId: string | null, sort: DueSort): DueItem[] {
  const byDate = (a: DueItem, b: DueItem) => (a.dueOn ?? "").localeCompare(b.dueOn ?? "");
  const list = items.filter((i) => storeId === null || i.storeId === storeId);
  return list.sort((a, b) => {
    if (sort === "store") return (a.storeName ?? "").localeCompare(b.storeName ?? "") || byDate(a, b);
    if (sort === "kind") return DUE_KIND_LABELS[a.kind].localeCompare(DUE_KIND_LABELS[b.kind]) || byDate(a, b);
    return byDate(a, b);
  });
}
