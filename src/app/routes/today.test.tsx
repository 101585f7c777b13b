import { fireEvent, screen, within } from "@testing-library/react";
import { describe, expect, it } from "vitest";
import type { TodayView } from "#core/contracts/compliance";
import { renderApp } from "../../../tests/helpers/render-client";
import { sessionFor } from "../../../tests/helpers/session-fixtures";
import { stubFetch } from "../../../tests/helpers/stub-fetch";

const A = "1d2c3b4a-5e6f-4a7b-8c9d-0e1f2a3b4c5d";
const B = "9f8e7d6c-5b4a-4c3d-9e2f-1a0b9c8d7e6f";
const SYS = "2b1c0d9e-8f7a-4b6c-9d5e-4f3a2b1c0d9e";
const FIND = "3c2d1e0f-9a8b-4c7d-8e6f-5a4b3c2d1e0f";

// Invented stores; the figures are what the server computed (its own tests check the formulas).
const today: TodayView = {
  generatedAt: "2026-05-01T12:00:00.000Z",
  wording: "us",
  stores: [
    { id: A, name: "Maple Street Market", timeZone: "America/Chicago", today: "2026-05-01" },
    { id: B, name: "Old Quay Depot", timeZone: "America/Chicago", today: "2026-05-01" },
  ],
  due: [
    {
      kind: "repair",
      what: "Repair: leak rate 37.6 % on 19 Apr 2026 is above 20 %",
      dueOn: "2026-05-19",
      state: "upcoming",
      daysLeft: 18,
      source: "40 CFR 84 subpart C; repair within 30 days",
      storeId: A,
      storeName: "Maple Street Market",
      systemId: SYS,
      systemName: "Rack A",
      findingId: null,
      detectorId: null,
      link: `/systems/${SYS}`,
    },
    {
      kind: "inspection",
      what: "Leak inspection",
      dueOn: "2026-05-03",
      state: "due-soon",
      daysLeft: 2,
      source: "[M] quarterly",
      storeId: B,
      storeName: "Old Quay Depot",
      systemId: SYS,
      systemName: "Rack Q",
      findingId: null,
      detectorId: null,
      link: `/systems/${SYS}`,
    },
  ],
  overThreshold: [
    {
      systemId: SYS,
      systemName: "Rack A",
      storeId: A,
      storeName: "Maple Street Market",
      refrigerantId: "R-448A",
      refrigerantName: "R-448A",
      percent: 37.6,
      thresholdPercent: 20,
      on: "2026-04-19",
      partTitle: "40 CFR 84 subpart C",
      source: "[S:R4]",
      link: `/systems/${SYS}`,
    },
  ],
  systems: [],
  openFindings: [
    {
      id: FIND,
      storeId: A,
      storeName: "Maple Street Market",
      systemId: SYS,
      systemName: "Rack A",
      status: "confirmed",
      component: "brazed-joint",
      foundOn: "2026-04-18",
      deadline: "2026-05-19",
      deadlineSource: "[S:R4]",
      link: `/findings/${FIND}`,
    },
  ],
};

describe("Today page", () => {
  it("lists due items with their rule and links, and narrows to one store", async () => {
    stubFetch({ "GET /api/auth/session": { body: sessionFor("engineer") }, "GET /api/today": { body: today } });
    renderApp("/today");
    const due = await screen.findByRole("table", { name: "Due and overdue" });
    const rows = within(due).getAllByRole("row").slice(1);
    expect(rows.map((r) => within(r).getAllByRole("link")[0].textContent)).toEqual([
      "Leak inspection",
      "Repair: leak rate 37.6 % on 19 Apr 2026 is above 20 %",
    ]);
    expect(
      within(due)
        .getByRole("link", { name: /Repair/ })
        .getAttribute("href"),
    ).toBe(`/systems/${SYS}`);
    expect(within(due).getByText(/Rule: 40 CFR 84 subpart C/)).toBeVisible();
    expect(screen.getByRole("link", { name: "37.6 %" }).getAttribute("href")).toBe(`/systems/${SYS}`);
    expect(screen.getByRole("link", { name: /Brazed joint on Rack A/ }).getAttribute("href")).toBe(`/findings/${FIND}`);
    // The rule data's source tags read as citations: "[M]" as unconfirmed, "[S:R4]" as 40 CFR 84 subpart C.
    expect(due.textContent).toContain("Rule: quarterly (reading)");
    expect(screen.getAllByText("40 CFR 84 subpart C")).toHaveLength(2); // over threshold (part title, tag not repeated) and the deadline
    expect(document.body.textContent).not.toMatch(/\[(S:|M\])/);
    fireEvent.change(screen.getByLabelText("Store"), { target: { value: B } });
    expect(within(screen.getByRole("table", { name: "Due and overdue" })).getAllByRole("row")).toHaveLength(2);
    expect(screen.getByText("No open findings.")).toBeVisible();
    // Engineers may not send the digest by hand; the button is the owner's.
    expect(screen.queryByRole("button", { name: "Send today's digest now" })).toBeNull();
  });

  it("lands owners on Today from /", async () => {
    stubFetch({ "GET /api/auth/session": { body: sessionFor("owner") }, "GET /api/today": { body: today } });
    const { router } = renderApp("/");
    await screen.findByRole("heading", { name: "Today" });
    expect(router.state.location.pathname).toBe("/today");
    expect(screen.getByRole("button", { name: "Send today's digest now" })).toBeVisible();
  });

  it("under EU F-gas shows leak checks, not leak rates: no over-threshold list, no rate or threshold column", async () => {
    // Regulation (EU) 2024/573 sets leak-check intervals by CO2-equivalent and no leak-rate threshold
    // (docs/reference/standards.md §2); invented store "Hafenkai Markt".
    const eu: TodayView = {
      generatedAt: "2026-05-01T12:00:00.000Z",
      wording: "eu",
      stores: [{ id: A, name: "Hafenkai Markt", timeZone: "Europe/Berlin", today: "2026-05-01" }],
      due: [],
      overThreshold: [],
      systems: [
        {
          id: SYS,
          name: "Verbund NK",
          storeId: A,
          storeName: "Hafenkai Markt",
          refrigerantId: "R-404A",
          refrigerantName: "R-404A",
          latestPercent: null,
          latestOn: null,
          thresholdPercent: null,
          breachOpen: false,
          repairedSince: false,
          nextInspection: "2026-09-14",
          link: `/systems/${SYS}`,
        },
      ],
      openFindings: [],
    };
    stubFetch({ "GET /api/auth/session": { body: sessionFor("engineer") }, "GET /api/today": { body: eu } });
    renderApp("/today");
    const systems = await screen.findByRole("table", { name: "Systems and their next leak check" });
    const headers = within(systems)
      .getAllByRole("columnheader")
      .map((h) => h.textContent);
    expect(headers.join(" | ")).toMatch(/Next leak check/);
    expect(headers.join(" | ")).not.toMatch(/leak rate|Threshold|inspection/i);
    expect(within(systems).getByRole("link", { name: "14 Sept 2026" }).getAttribute("href")).toBe(
      `/systems/${SYS}#checks`,
    );
    expect(screen.queryByRole("heading", { name: "Systems over threshold" })).toBeNull();
  });
});
