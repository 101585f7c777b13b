import { screen } from "@testing-library/react";
import { describe, expect, it } from "vitest";
import type { FindingDetail } from "#core/contracts/finding-actions";
import { renderOnRoute } from "../../../../tests/helpers/render-client";
import { stubFetch } from "../../../../tests/helpers/stub-fetch";
import { FindingView } from "./finding-view";

const finding: FindingDetail = {
  id: "6f1e2b1c-3d4e-4f50-8a6b-7c8d9e0f1a2b",
  storeId: "1f1e2b1c-3d4e-4f50-8a6b-7c8d9e0f1a2b",
  systemId: null,
  planId: "2f1e2b1c-3d4e-4f50-8a6b-7c8d9e0f1a2b",
  sweepId: null,
  fixtureId: null,
  x: 3.048,
  y: 1.2192,
  component: "flare",
  source: "manual",
  status: "confirmed",
  note: "",
  foundAt: "2026-11-02T15:00:00Z",
  foundBy: "Ada Quill",
  events: [],
  photos: [],
  storeName: "Harbour Lane",
  timeZone: "America/Chicago",
  systemName: null,
  fixtureLabel: "Dairy 3",
  refrigerantId: null,
  dismissReason: null,
  nextActions: [],
  systemRetiredOn: null,
  deadlines: [
    {
      what: "Repair",
      dueOn: "2026-12-02",
      state: "due-soon",
      daysLeft: 3,
      source: "[S:R1] 40 CFR 82.157(c); [S:R4] 84.106",
    },
  ],
  cautions: [],
};

describe("finding view", () => {
  it("gives the position in the member's units", () => {
    stubFetch({});
    // 3.048 m = 10 ft and 1.2192 m = 4 ft exactly (1 ft = 0.3048 m, NIST SP 811).
    renderOnRoute(<FindingView finding={finding} canAddPhoto={false} lengthUnit="ft-in" />, { path: "/findings/x" });
    expect(
      screen.getByText(/At Dairy 3, 10 ft 0 in across and 4 ft 0 in down from the plan's top-left corner\./),
    ).toBeVisible();
    expect(document.body.textContent).not.toMatch(/\d m across/);
  });
  it("in metres by default, with rule sources as citations", () => {
    stubFetch({});
    renderOnRoute(<FindingView finding={finding} canAddPhoto={false} />, { path: "/findings/x" });
    expect(screen.getByText(/At Dairy 3, 3\.0 m across and 1\.2 m down/)).toBeVisible();
    expect(screen.getByText("Rule: 40 CFR 82.157(c); 40 CFR 84.106")).toBeVisible();
  });
});
