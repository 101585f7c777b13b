import { render, screen, within } from "@testing-library/react";
import { describe, expect, it } from "vitest";
import type { SystemRecordsView } from "#core/contracts/compliance";
import { SystemPlots } from "./system-plots";

const addition = (id: string, addedOn: string, amountKg: number) => ({
  id,
  systemId: "00000000-0000-4000-8000-000000000000",
  addedOn,
  amountKg,
  enteredValue: amountKg,
  enteredUnit: "kg" as const,
  technician: "Ines",
  reason: "Top-up",
  excluded: null,
  findingId: null,
  correctsId: null,
  recordedBy: "Ines",
  recordedAt: `${addedOn}T12:00:00Z`,
  voided: null,
});

const records = (leakRateRules: boolean) =>
  ({
    profile: { leakRateRules },
    additions: [addition("a", "2026-01-15", 0.45359237 * 4), addition("b", "2026-03-01", 0.45359237 * 10)],
    leakRates: [
      {
        date: "2026-01-15",
        method: "annualizing",
        percent: 4,
        countedKg: 1.8,
        days: 365,
        windowStart: null,
        additionIds: ["a"],
        partId: "p",
        thresholdPercent: 20,
        exceeds: false,
        repairDue: null,
      },
      {
        date: "2026-03-01",
        method: "annualizing",
        percent: 81.1,
        countedKg: 4.5,
        days: 45,
        windowStart: null,
        additionIds: ["b"],
        partId: "p",
        thresholdPercent: 20,
        exceeds: true,
        repairDue: "2026-03-31",
      },
    ],
    leakChecks: [{ id: "c", checkedOn: "2026-02-01", leakFound: true, note: "", by: "Ines" }],
  }) as unknown as SystemRecordsView;

describe("system plots", () => {
  it("under a threshold rule: the leak rate against the threshold and the charge added, each with its data as a table", () => {
    render(<SystemPlots r={records(true)} unit="lb" numberFormat="1,234.5" />);
    const rate = screen.getByRole("figure", { name: "Leak rate at each addition" });
    expect(within(rate).getByText(/2 figures, 1 above the threshold/)).toBeInTheDocument();
    const rows = within(rate)
      .getAllByRole("row")
      .map((r) => r.textContent);
    expect(rows).toEqual(["DateLeak rate (% per year)Threshold (% per year)", "15 Jan 20264.020", "1 Mar 202681.120"]);
    const charge = screen.getByRole("figure", { name: "Charge added over time" });
    // in the reader's unit: 4 lb then 10 lb, 14 lb in all (1 lb = 0.45359237 kg, NIST SP 811)
    expect(within(charge).getByText(/14\.0 lb added on 2 days/)).toBeInTheDocument();
    expect(screen.queryByRole("figure", { name: /leak checks/ })).toBeNull();
  });

  it("under EU F-gas: no leak-rate plot; the charge added and the leak checks", () => {
    // A decimal-comma company: 14 lb is 6.35029318 kg (NIST SP 811), written "6,35" as de-DE's CLDR symbols have it.
    render(<SystemPlots r={records(false)} unit="kg" numberFormat="1.234,5" />);
    expect(screen.queryByRole("figure", { name: "Leak rate at each addition" })).toBeNull();
    const plot = screen.getByRole("figure", { name: "Charge added and leak checks over time" });
    expect(within(plot).getByText(/1 leak check, 1 finding a leak/)).toBeInTheDocument();
    expect(within(plot).getByText(/^6,35 kg added on 2 days/)).toBeInTheDocument();
    expect(within(plot).getByRole("cell", { name: "6,35" })).toBeInTheDocument();
    expect(within(plot).getByRole("cell", { name: "leak found" })).toBeInTheDocument();
  });
});
