import { screen } from "@testing-library/react";
import { describe, expect, it } from "vitest";
import { renderApp } from "../../../tests/helpers/render-client";
import { sessionFor } from "../../../tests/helpers/session-fixtures";
import { stubFetch } from "../../../tests/helpers/stub-fetch";

// A store contact gets the sweep's report, never its field map or readings (decision 0072). The
// server refuses those routes with 403; these screens must not even ask for them.

const STORE = "1d2c3b4a-5e6f-4a7b-8c9d-0e1f2a3b4c5d";
const SWEEP = "7a1b2c3d-4e5f-4a6b-8c7d-9e0f1a2b3c4d";
const store = {
  id: STORE,
  name: "Maple Street Market",
  address: "14 Maple Street, Brookfield",
  timeZone: "America/Chicago",
  archivedAt: null,
  createdAt: "2026-01-05T15:00:00.000Z",
  updatedAt: "2026-01-05T15:00:00.000Z",
};
const sweep = (id: string, startedAt: string) => ({
  id,
  storeId: STORE,
  planId: "2b3c4d5e-6f70-4a1b-8c2d-3e4f5a6b7c8d",
  detectorId: "3c4d5e6f-7081-4b2c-9d3e-4f5a6b7c8d9e",
  detectorName: "Heated diode",
  technicianId: "4d5e6f70-8192-4c3d-8e4f-5a6b7c8d9e0f",
  technicianName: "Rosa Tran",
  systemIds: [],
  fans: "running",
  defrost: false,
  status: "reviewed",
  transportDelayS: 5,
  timeConstantS: 2,
  alarmPpm: 2,
  warnings: [],
  startedAt,
  submittedAt: startedAt,
  reviewedAt: startedAt,
  readingsRevision: 1,
  readingCount: 40,
});

function stubContact(asked: string[]) {
  stubFetch({
    "GET /api/auth/session": { body: sessionFor("store-contact") },
    "GET /api/stores": { body: { stores: [store] } },
    [`GET /api/stores/${STORE}/sweeps`]: {
      body: {
        sweeps: [sweep(SWEEP, "2026-11-03T15:00:00.000Z"), sweep(crypto.randomUUID(), "2026-10-02T15:00:00.000Z")],
      },
    },
    [`GET /api/sweeps/${SWEEP}`]: { body: sweep(SWEEP, "2026-11-03T15:00:00.000Z") },
    [`GET /api/stores/${STORE}/findings`]: { body: { findings: [] } },
    [`GET /api/sweeps/${SWEEP}/analysis`]: () => {
      asked.push("analysis");
      return { status: 403, body: { error: { code: "forbidden", message: "no", fields: {} } } };
    },
  });
}

describe("a store contact's sweeps", () => {
  it("lists sweeps with their reports and offers no month comparison", async () => {
    stubContact([]);
    renderApp(`/stores/${STORE}/sweeps`);
    const open = await screen.findAllByRole("link", { name: "Open report" });
    expect(open).toHaveLength(2);
    expect(screen.queryByRole("link", { name: "Open field map" })).toBeNull();
    expect(screen.queryByRole("link", { name: "Compare months" })).toBeNull();
  });

  it("opens a sweep as its report, without asking for the field map", async () => {
    const asked: string[] = [];
    stubContact(asked);
    renderApp(`/stores/${STORE}/sweeps/${SWEEP}/map`);
    const pdf = await screen.findByRole("link", { name: "Download the report (PDF)" });
    expect(pdf).toHaveAttribute("href", `/api/sweeps/${SWEEP}/report.pdf`);
    expect(screen.getByText("No leak was recorded on this sweep.")).toBeVisible();
    expect(screen.getByText(/Walked by Rosa Tran/)).toBeVisible();
    expect(asked).toEqual([]);
  });

  it("finds no compare page", async () => {
    stubContact([]);
    renderApp(`/stores/${STORE}/compare`);
    expect(await screen.findByRole("heading", { name: "Page not found" })).toBeVisible();
  });
});
