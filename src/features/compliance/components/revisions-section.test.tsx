import { fireEvent, screen, waitFor } from "@testing-library/react";
import { beforeEach, describe, expect, it } from "vitest";
import type { SystemRecordsView } from "#core/contracts/compliance";
import { renderOnRoute } from "../../../../tests/helpers/render-client";
import { stubFetch } from "../../../../tests/helpers/stub-fetch";
import { setCsrfToken } from "../../../lib/api-client";
import { RevisionsSection } from "./revisions-section";

beforeEach(() => setCsrfToken("csrf-engineer"));

const SYSTEM_ID = "5a0e7c1e-2b3d-4f5a-8b9c-0d1e2f3a4b5c";
const system = {
  id: SYSTEM_ID,
  refrigerantId: "R-22",
  fullChargeKg: 45.359237, // 100 lb × 0.45359237 (NIST SP 811)
  applianceType: "commercial-refrigeration",
  automaticLeakDetection: false,
  retired: null,
};
const r = { system, today: "2026-06-10" } as unknown as SystemRecordsView;
const first = {
  id: "8f1e2d3c-4b5a-4697-8877-665544332211",
  effectiveFrom: "2015-04-01",
  kind: "first",
  refrigerantId: "R-22",
  refrigerantName: "R-22",
  fullChargeKg: 45.359237,
  applianceType: "commercial-refrigeration",
  automaticLeakDetection: false,
  inServiceOn: "2015-04-01",
  reason: "Entered",
  by: "Dana Okafor",
  recordedAt: "2026-01-05T10:00:00.000Z",
};

describe("system history on the records page", () => {
  it("lists the dated revisions and sends a retrofit with only what changed", async () => {
    const calls = stubFetch({
      [`GET /api/systems/${SYSTEM_ID}/revisions`]: { body: { revisions: [first] } },
      [`POST /api/systems/${SYSTEM_ID}/revisions`]: {
        status: 400,
        body: { error: { code: "validation_failed", message: "Please check." } },
      },
    });
    renderOnRoute(<RevisionsSection r={r} unit="lb" numberFormat="1,234.5" canRevise />, { path: "/systems/x" });
    expect(await screen.findByText("First values")).toBeVisible();
    expect(screen.getByText("100.0 lb")).toBeVisible();
    fireEvent.change(screen.getByLabelText("Kind"), { target: { value: "retrofit" } });
    fireEvent.change(screen.getByLabelText("Refrigerant"), { target: { value: "R-448A" } });
    fireEvent.change(screen.getByLabelText("In force from"), { target: { value: "2026-05-01" } });
    fireEvent.change(screen.getByLabelText("Reason"), { target: { value: "Converted to R-448A" } });
    fireEvent.click(screen.getByRole("button", { name: "Record the change" }));
    await waitFor(() => expect(calls.some((c) => c.method === "POST")).toBe(true));
    expect(calls.find((c) => c.method === "POST")!.body).toEqual({
      effectiveFrom: "2026-05-01",
      kind: "retrofit",
      reason: "Converted to R-448A",
      refrigerantId: "R-448A",
    });
  });

  it("offers no form to those who may not revise", async () => {
    stubFetch({ [`GET /api/systems/${SYSTEM_ID}/revisions`]: { body: { revisions: [first] } } });
    renderOnRoute(<RevisionsSection r={r} unit="kg" numberFormat="1,234.5" canRevise={false} />, {
      path: "/systems/x",
    });
    expect(await screen.findByText("45.36 kg")).toBeVisible();
    expect(screen.queryByRole("button", { name: "Record the change" })).toBeNull();
  });

  it("reads a full charge in a decimal-comma company's format, echoes it and sends twelve hundred and a half", async () => {
    const calls = stubFetch({
      [`GET /api/systems/${SYSTEM_ID}/revisions`]: { body: { revisions: [first] } },
      [`POST /api/systems/${SYSTEM_ID}/revisions`]: {
        status: 400,
        body: { error: { code: "validation_failed", message: "Please check." } },
      },
    });
    renderOnRoute(<RevisionsSection r={r} unit="lb" numberFormat="1.234,5" canRevise />, { path: "/systems/x" });
    // 100 lb written as the company writes numbers (de-DE's CLDR symbols: "100,0").
    expect(await screen.findByText("100,0 lb")).toBeVisible();
    const charge = screen.getByLabelText("Full charge (lb)");
    expect(charge).toHaveValue("100");
    fireEvent.change(charge, { target: { value: "1.5" } });
    fireEvent.change(screen.getByLabelText("Reason"), { target: { value: "Recounted the charge" } });
    fireEvent.click(screen.getByRole("button", { name: "Record the change" }));
    // Refused with the reason, nothing sent, the text kept.
    expect(await screen.findByText(/must group thousands in threes/)).toBeVisible();
    expect(calls.some((c) => c.method === "POST")).toBe(false);
    expect(charge).toHaveValue("1.5");
    fireEvent.change(charge, { target: { value: "1.200,5" } });
    expect(screen.getByText("Read as 1.200,5 lb")).toBeVisible();
    fireEvent.click(screen.getByRole("button", { name: "Record the change" }));
    await waitFor(() => expect(calls.some((c) => c.method === "POST")).toBe(true));
    expect(calls.find((c) => c.method === "POST")!.body).toMatchObject({
      fullCharge: { value: 1200.5, unit: "lb" },
      reason: "Recounted the charge",
    });
  });
});
