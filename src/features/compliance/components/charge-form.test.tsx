import { fireEvent, screen, waitFor } from "@testing-library/react";
import { beforeEach, describe, expect, it } from "vitest";
import { renderOnRoute } from "../../../../tests/helpers/render-client";
import { stubFetch } from "../../../../tests/helpers/stub-fetch";
import { setCsrfToken } from "../../../lib/api-client";
import { ChargeForm } from "./charge-form";

beforeEach(() => setCsrfToken("csrf-engineer"));

const SYSTEM_ID = "5a0e7c1e-2b3d-4f5a-8b9c-0d1e2f3a4b5c";
const refused = { status: 400, body: { error: { code: "validation_failed", message: "Please check." } } };

describe("recording charge added", () => {
  // 40 CFR 82.157: no leak-rate calculation after a retrofit, a new installation or a seasonal
  // variance (docs/reference/standards.md §1 [S:R1]); the fill is recorded, marked, and counts no loss.
  it("marks the fill after a retrofit as not counted, so it makes no leak-rate figure", async () => {
    const calls = stubFetch({ [`POST /api/systems/${SYSTEM_ID}/charge-additions`]: refused });
    renderOnRoute(
      <ChargeForm systemId={SYSTEM_ID} today="2026-05-10" unit="lb" numberFormat="1,234.5" findings={[]} />,
      { path: "/systems/x" },
    );
    fireEvent.change(screen.getByLabelText("Amount added"), { target: { value: "165" } });
    fireEvent.change(screen.getByLabelText("Reason"), { target: { value: "Charged with R-448A after the retrofit" } });
    fireEvent.change(screen.getByLabelText("Leak-rate calculation"), { target: { value: "retrofit" } });
    fireEvent.click(screen.getByRole("button", { name: "Record charge added" }));
    await waitFor(() => expect(calls.some((c) => c.method === "POST")).toBe(true));
    expect(calls.find((c) => c.method === "POST")!.body).toEqual({
      addedOn: "2026-05-10",
      amount: { value: 165, unit: "lb" },
      reason: "Charged with R-448A after the retrofit",
      findingId: null,
      excluded: "retrofit",
    });
  });

  it("counts an ordinary top-up as leak loss unless told otherwise", async () => {
    const calls = stubFetch({ [`POST /api/systems/${SYSTEM_ID}/charge-additions`]: refused });
    renderOnRoute(
      <ChargeForm systemId={SYSTEM_ID} today="2026-05-10" unit="lb" numberFormat="1,234.5" findings={[]} />,
      { path: "/systems/x" },
    );
    expect(screen.getByLabelText("Leak-rate calculation")).toHaveValue("");
    fireEvent.change(screen.getByLabelText("Amount added"), { target: { value: "12" } });
    fireEvent.change(screen.getByLabelText("Reason"), { target: { value: "Top-up" } });
    fireEvent.click(screen.getByRole("button", { name: "Record charge added" }));
    await waitFor(() => expect(calls.some((c) => c.method === "POST")).toBe(true));
    expect(calls.find((c) => c.method === "POST")!.body).toMatchObject({ excluded: null });
  });
});
