import { fireEvent, screen, waitFor } from "@testing-library/react";
import { beforeEach, describe, expect, it } from "vitest";
import type { RuleProfileInput } from "#core/contracts/rule-profile";
import { startCustomProfile } from "#core/domain/compliance/company-profile";
import { renderOnRoute } from "../../../../tests/helpers/render-client";
import { stubFetch } from "../../../../tests/helpers/stub-fetch";
import { setCsrfToken } from "../../../lib/api-client";
import { CustomProfileEditor } from "./custom-profile-editor";

beforeEach(() => setCsrfToken("csrf-owner"));

const us = startCustomProfile("us-federal") as RuleProfileInput;
const eu = startCustomProfile("eu-fgas") as RuleProfileInput;

describe("custom rule profile editor", () => {
  it("refuses a negative threshold and a missing source before sending, naming the field", async () => {
    const calls = stubFetch({});
    renderOnRoute(<CustomProfileEditor profile={us} editable />, { path: "/settings" });
    // The second part is 40 CFR 84 subpart C; its commercial threshold starts at 20 % [S:R4].
    const threshold = screen.getAllByLabelText("Commercial refrigeration")[1] as HTMLInputElement;
    expect(threshold.value).toBe("20");
    fireEvent.change(threshold, { target: { value: "-5" } });
    fireEvent.change(screen.getAllByLabelText("Source for “Commercial refrigeration”")[1], { target: { value: "" } });
    fireEvent.click(screen.getByRole("button", { name: "Save custom profile" }));
    expect(await screen.findByText("Commercial refrigeration must be above 0 (% per year).")).toBeVisible();
    expect(
      screen.getByText("Source for “Commercial refrigeration” is required (a citation, or who set the value and why)."),
    ).toBeVisible();
    expect(calls).toHaveLength(0);
  });

  it("sends the edited value with its source", async () => {
    const calls = stubFetch({
      "PUT /api/company/custom-profile": (req) => ({
        body: { profile: req.body, savedAt: "2026-12-01T10:00:00.000Z", savedBy: "Dana Okafor", inForce: true },
      }),
    });
    renderOnRoute(<CustomProfileEditor profile={us} editable />, { path: "/settings" });
    fireEvent.change(screen.getAllByLabelText("Repair within (days)")[1], { target: { value: "14" } });
    fireEvent.change(screen.getAllByLabelText("Source for “Repair within (days)”")[1], {
      target: { value: "company policy: repair within 14 days" },
    });
    fireEvent.click(screen.getByRole("button", { name: "Save custom profile" }));
    await waitFor(() => expect(calls.filter((c) => c.method === "PUT")).toHaveLength(1));
    const sent = calls.find((c) => c.method === "PUT")!.body as RuleProfileInput;
    expect(sent.leakRateParts[1].repairDays).toEqual({ value: 14, source: "company policy: repair within 14 days" });
    expect(sent.leakRateParts[0].repairDays.value).toBe(30);
    expect(sent.recordRetentionYears.value).toBe(3); // 3 years US [S:R6,R7], unchanged
    expect(sent.leakRateParts[1].chronicLeaker.reportBy.value).toEqual({ month: 3, day: 1 }); // 1 March [S:R7]
    expect(await screen.findByText(/Custom profile saved/)).toBeVisible();
  });

  it("checks that CO2e bands ascend without gaps", async () => {
    const calls = stubFetch({});
    renderOnRoute(<CustomProfileEditor profile={eu} editable />, { path: "/settings" });
    // EU bands 5–50–500 t [S:E1]: moving the second band's lower edge leaves a gap.
    fireEvent.change(screen.getByLabelText("Band 2: from (t)"), { target: { value: "60" } });
    fireEvent.click(screen.getByRole("button", { name: "Save custom profile" }));
    expect(
      await screen.findByText(
        "Band 2: from (t) must equal the band below's upper edge (50), so bands ascend without gaps or overlaps.",
      ),
    ).toBeVisible();
    expect(calls).toHaveLength(0);
  });

  it("adds a band on top with edges that still ascend", () => {
    stubFetch({});
    renderOnRoute(<CustomProfileEditor profile={eu} editable />, { path: "/settings" });
    fireEvent.click(screen.getByRole("button", { name: "Add a band on top" }));
    expect((screen.getByLabelText("Band 3: below (t)") as HTMLInputElement).value).toBe("5000");
    expect((screen.getByLabelText("Band 4: from (t)") as HTMLInputElement).value).toBe("5000");
    expect((screen.getByLabelText("Band 4: below (t)") as HTMLInputElement).value).toBe("");
    fireEvent.click(screen.getByRole("button", { name: "Remove the top band" }));
    expect(screen.queryByLabelText("Band 4: from (t)")).toBeNull();
    expect((screen.getByLabelText("Band 3: below (t)") as HTMLInputElement).value).toBe("");
  });

  it("is read-only without settings.manage", () => {
    stubFetch({});
    renderOnRoute(<CustomProfileEditor profile={us} editable={false} />, { path: "/settings" });
    expect(screen.getAllByLabelText("Commercial refrigeration")[0].matches(":disabled")).toBe(true);
    expect(screen.queryByRole("button", { name: "Save custom profile" })).toBeNull();
  });
});
