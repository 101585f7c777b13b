import { screen } from "@testing-library/react";
import { describe, expect, it } from "vitest";
import type { FindingDetail } from "#core/contracts/finding-actions";
import { renderOnRoute } from "../../../../tests/helpers/render-client";
import { stubFetch } from "../../../../tests/helpers/stub-fetch";
import { FindingsPanel } from "./findings-panel";

const event = (
  kind: FindingDetail["events"][number]["kind"],
  status: FindingDetail["status"],
  on: string,
  by: string,
) => ({
  id: crypto.randomUUID(),
  kind,
  status,
  on,
  at: `${on}T15:00:00Z`,
  by,
  byId: crypto.randomUUID(),
  note: "",
  result: kind.endsWith("-test") ? ("passed" as const) : null,
});

describe("findings panel", () => {
  it("names each step of the history once: a verification test is not another repair", () => {
    stubFetch({});
    const finding = {
      id: crypto.randomUUID(),
      storeId: crypto.randomUUID(),
      systemId: null,
      planId: null,
      sweepId: null,
      fixtureId: null,
      x: 1,
      y: 1,
      component: "coil",
      source: "suspect-spot",
      status: "repaired",
      note: "",
      foundAt: "2026-11-02T15:00:00Z",
      foundBy: "Ada Quill",
      events: [
        event("found", "suspected", "2026-11-02", "Ada Quill"),
        event("confirmed", "confirmed", "2026-11-03", "Ada Quill"),
        event("repaired", "repaired", "2026-11-03", "Ben Ortiz"),
        event("initial-test", "repaired", "2026-11-03", "Ben Ortiz"),
      ],
      photos: [],
    } as unknown as Parameters<typeof FindingsPanel>[0]["findings"][number];
    renderOnRoute(<FindingsPanel findings={[finding]} canRecord={false} today="2026-11-04" label={() => "Dairy 3"} />, {
      path: "/x",
    });
    expect(screen.getAllByText(/Repaired by Ben Ortiz/)).toHaveLength(1);
    expect(screen.getByText(/Initial verification test \(passed\) by Ben Ortiz/)).toBeVisible();
    // Days read as everywhere else in the app ("2 Nov 2026"), never as ISO text.
    expect(screen.getByText(/2 Nov 2026: Found/)).toBeVisible();
    expect(screen.queryByText(/2026-11-0\d:/)).toBeNull();
  });
});
