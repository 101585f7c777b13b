import { fireEvent, screen, waitFor } from "@testing-library/react";
import { beforeEach, describe, expect, it, vi } from "vitest";
import { checkCompanyRefrigerant, toCompanyRefrigerant } from "#core/domain/refrigerants/company-refrigerant";
import { summarizeRefrigerant } from "#core/domain/refrigerants/refrigerant-summary";
import { renderOnRoute } from "../../../../tests/helpers/render-client";
import { apiError, stubFetch } from "../../../../tests/helpers/stub-fetch";
import { setCsrfToken } from "../../../lib/api-client";
import { CompanyRefrigerantForm } from "./company-refrigerant-form";

const ROW_ID = "3c4d5e6f-7a8b-4c9d-8e0f-1a2b3c4d5e6f";

/** The server's answer for a saved entry, built by the same domain code the server runs. */
function savedView(facts: Parameters<typeof checkCompanyRefrigerant>[0]) {
  const checked = checkCompanyRefrigerant(facts);
  const r = toCompanyRefrigerant({ ...checked, id: ROW_ID, retired: false });
  return {
    rowId: ROW_ID,
    summary: summarizeRefrigerant(r, { bases: ["AR4"], statement: "IPCC AR4 100-year values" }),
    safetyClass: checked.safetyClass,
    substanceClass: checked.substanceClass,
    composition: checked.components?.map((c) => ({ refrigerantId: c.id, massPercent: c.massPercent })) ?? null,
    statedGwp: checked.statedGwp,
    molarMass: checked.molarMass,
    systemsUsing: 0,
    retired: false,
    enteredBy: "Lead of Birchmoor",
    enteredAt: "2026-12-05T09:00:00.000Z",
  };
}

beforeEach(() => setCsrfToken("csrf-lead"));

describe("company refrigerant form", () => {
  it("reads mass per cents in a decimal-comma company's format and shows the server's refusal at the field", async () => {
    const calls = stubFetch({
      "POST /api/company-refrigerants": apiError(400, "validation_failed", "Please check: composition.", {
        composition: "mass per cents add up to 99.8 %, not 100 % (within ±0.1 percentage points)",
      }),
    });
    renderOnRoute(<CompanyRefrigerantForm numberFormat="1.234,5" onDone={() => {}} onCancel={() => {}} />);
    fireEvent.change(screen.getByLabelText("Name"), { target: { value: "Split mix" } });
    fireEvent.change(screen.getByLabelText("Component 1"), { target: { value: "R-32" } });
    fireEvent.change(screen.getByLabelText("Component 1 mass %"), { target: { value: "50" } });
    fireEvent.change(screen.getByLabelText("Component 2"), { target: { value: "R-125" } });
    fireEvent.change(screen.getByLabelText("Component 2 mass %"), { target: { value: "49,8" } });
    expect(screen.getByText("Total 99,8 % (must be 100 % within ±0,1 percentage points)")).toBeVisible();
    fireEvent.click(screen.getByRole("button", { name: "Save refrigerant" }));
    expect(await screen.findByText(/Composition mass per cents add up to 99\.8 %/, { selector: "p" })).toBeVisible();
    expect(calls.find((c) => c.method === "POST")!.body).toEqual({
      name: "Split mix",
      safetyClass: "A1",
      composition: [
        { refrigerantId: "R-32", massPercent: 50 },
        { refrigerantId: "R-125", massPercent: 49.8 },
      ],
    });
    // Nothing typed is lost on a refusal.
    expect((screen.getByLabelText("Component 2 mass %") as HTMLInputElement).value).toBe("49,8");
    expect((screen.getByLabelText("Name") as HTMLInputElement).value).toBe("Split mix");
  });

  it("asks for the GWP's source and class before any request, then saves and names what it saved", async () => {
    const facts = {
      name: "Imported HFC mix",
      safetyClass: "A2L" as const,
      substanceClass: "hfc" as const,
      statedGwp: { value: 2500, basis: "AR4" as const, source: "maker's data sheet" },
    };
    const calls = stubFetch({ "POST /api/company-refrigerants": { status: 201, body: savedView(facts) } });
    const onDone = vi.fn();
    renderOnRoute(<CompanyRefrigerantForm numberFormat="1,234.5" onDone={onDone} onCancel={() => {}} />);
    fireEvent.change(screen.getByLabelText("Name"), { target: { value: facts.name } });
    fireEvent.change(screen.getByLabelText(/Safety group/), { target: { value: "A2L" } });
    fireEvent.click(screen.getByLabelText("By a published GWP"));
    fireEvent.change(screen.getByLabelText("GWP (100-year)"), { target: { value: "2,500" } });
    fireEvent.click(screen.getByRole("button", { name: "Save refrigerant" }));
    expect(await screen.findByText("Where the GWP comes from is required.")).toBeVisible();
    expect(calls.filter((c) => c.method === "POST")).toHaveLength(0);

    fireEvent.change(screen.getByLabelText(/Where the GWP comes from/), { target: { value: facts.statedGwp.source } });
    fireEvent.change(screen.getByLabelText(/What it contains/), { target: { value: "hfc" } });
    fireEvent.click(screen.getByRole("button", { name: "Save refrigerant" }));
    await waitFor(() => expect(onDone).toHaveBeenCalledWith("Imported HFC mix"));
    expect(calls.find((c) => c.method === "POST")!.body).toEqual({ ...facts, molarMass: null });
  });
});
