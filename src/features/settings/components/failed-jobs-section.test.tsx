import { screen, within } from "@testing-library/react";
import { describe, expect, it } from "vitest";
import { renderOnRoute } from "../../../../tests/helpers/render-client";
import { stubFetch } from "../../../../tests/helpers/stub-fetch";
import { FailedJobsSection } from "./failed-jobs-section";

describe("failed jobs panel", () => {
  it("lists each failed job with its kind, when it was queued, its attempts and the reason", async () => {
    stubFetch({
      "GET /api/jobs/failed": {
        body: {
          jobs: [
            {
              id: "0b1c2d3e-4f5a-4b6c-8d7e-9f0a1b2c3d4e",
              kind: "analysis",
              subjectId: "1c2d3e4f-5a6b-4c7d-8e9f-0a1b2c3d4e5f",
              to: [],
              subject: "Field map computation",
              attempts: 3,
              reason: "took longer than its time limit of 120 s",
              queuedAt: "2026-12-01T09:30:00.000Z",
            },
            {
              id: "2d3e4f5a-6b7c-4d8e-9f0a-1b2c3d4e5f6a",
              kind: "invitation",
              subjectId: null,
              to: ["pell.garth@larchmere.example"],
              subject: "You are invited to Larchmere Grocers",
              attempts: 9,
              reason: "The mail server could not be reached.",
              queuedAt: "2026-12-01T08:00:00.000Z",
            },
          ],
        },
      },
    });
    renderOnRoute(<FailedJobsSection />, { path: "/settings" });
    const table = await screen.findByRole("table", { name: "Failed jobs, newest first" });
    const rows = within(table).getAllByRole("row").slice(1);
    expect(rows).toHaveLength(2);
    expect(within(rows[0]).getByText("Field map")).toBeVisible();
    expect(within(rows[0]).getByText("3")).toBeVisible();
    expect(within(rows[0]).getByText("took longer than its time limit of 120 s")).toBeVisible();
    expect(within(rows[1]).getByText("Invitation e-mail")).toBeVisible();
    expect(within(rows[1]).getByText(/pell\.garth@larchmere\.example/)).toBeVisible();
    expect(within(rows[1]).getByText("The mail server could not be reached.")).toBeVisible();
    // The queued time is shown, not left out.
    expect(rows[0].textContent).toMatch(/2026/);
  });

  it("says so when nothing has failed", async () => {
    stubFetch({ "GET /api/jobs/failed": { body: { jobs: [] } } });
    renderOnRoute(<FailedJobsSection />, { path: "/settings" });
    expect(await screen.findByText("No failed jobs")).toBeVisible();
  });
});
