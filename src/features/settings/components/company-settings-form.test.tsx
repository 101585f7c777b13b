import { fireEvent, screen, waitFor } from "@testing-library/react";
import { beforeEach, describe, expect, it, vi } from "vitest";
import type { CompanySettings } from "#core/contracts/company";
import { renderOnRoute } from "../../../../tests/helpers/render-client";
import { stubFetch } from "../../../../tests/helpers/stub-fetch";
import { setCsrfToken } from "../../../lib/api-client";
import { CompanySettingsForm } from "./company-settings-form";

const settings: CompanySettings = {
  name: "Northfield Cold Care",
  lengthUnit: "ft-in",
  massUnit: "lb",
  numberFormat: "1,234.5",
  ruleProfile: "us-federal",
  leakRateMethod: "annualizing",
  detectorCheckIntervalDays: 30,
  paperSize: "profile",
};

beforeEach(() => setCsrfToken("csrf-owner"));

describe("company settings form", () => {
  it("is read-only, with a note, for someone without settings.manage", () => {
    stubFetch({});
    renderOnRoute(<CompanySettingsForm settings={settings} editable={false} />, { path: "/settings" });
    expect(screen.getByText(/Only an owner can change these settings/)).toBeVisible();
    expect(screen.getByLabelText("Company name").matches(":disabled")).toBe(true);
    expect(screen.getByLabelText("Rule profile").matches(":disabled")).toBe(true);
    expect(screen.queryByRole("button", { name: "Save settings" })).toBeNull();
  });

  it("checks the interval with the shared schema before sending", async () => {
    const calls = stubFetch({});
    renderOnRoute(<CompanySettingsForm settings={settings} editable />, { path: "/settings" });
    fireEvent.change(screen.getByLabelText("Detector check interval (days)"), { target: { value: "2.5" } });
    fireEvent.click(screen.getByRole("button", { name: "Save settings" }));
    // companySettings.detectorCheckIntervalDays in core/contracts/company.ts
    expect(await screen.findByText("Detector check interval (days) must be a whole number of days.")).toBeVisible();
    fireEvent.change(screen.getByLabelText("Detector check interval (days)"), { target: { value: "0" } });
    fireEvent.click(screen.getByRole("button", { name: "Save settings" }));
    expect(await screen.findByText("Detector check interval (days) must be at least 1 day.")).toBeVisible();
    expect(calls).toHaveLength(0);
  });

  it("saves units and the rule profile for an owner", async () => {
    const calls = stubFetch({ "PUT /api/company/settings": (req) => ({ body: req.body }) });
    const onSaved = vi.fn();
    renderOnRoute(<CompanySettingsForm settings={settings} editable onSaved={onSaved} />, { path: "/settings" });
    fireEvent.change(screen.getByLabelText("Length"), { target: { value: "m" } });
    fireEvent.change(screen.getByLabelText("Mass"), { target: { value: "kg" } });
    fireEvent.change(screen.getByLabelText("Number format"), { target: { value: "1.234,5" } });
    fireEvent.change(screen.getByLabelText("Rule profile"), { target: { value: "eu-fgas" } });
    fireEvent.change(screen.getByLabelText("Leak-rate method"), { target: { value: "rolling-average" } });
    fireEvent.change(screen.getByLabelText("Detector check interval (days)"), { target: { value: "90" } });
    fireEvent.change(screen.getByLabelText("Paper size of PDFs"), { target: { value: "letter" } });
    fireEvent.click(screen.getByRole("button", { name: "Save settings" }));

    expect(await screen.findByText("Settings saved.")).toBeVisible();
    expect(calls[0]!.body).toEqual({
      ...settings,
      lengthUnit: "m",
      massUnit: "kg",
      numberFormat: "1.234,5",
      ruleProfile: "eu-fgas",
      leakRateMethod: "rolling-average",
      detectorCheckIntervalDays: 90,
      paperSize: "letter",
    });
    await waitFor(() => expect(onSaved).toHaveBeenCalledTimes(1));
  });
});
