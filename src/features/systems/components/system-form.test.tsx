import { fireEvent, screen, waitFor } from "@testing-library/react";
import { beforeEach, describe, expect, it } from "vitest";
import { refrigerantCautions, summarizeRefrigerant } from "#core/domain/refrigerants/refrigerant-summary";
import { REFRIGERANTS } from "#core/domain/refrigerants/catalogue";
import { cautionsFor } from "#core/domain/safety/cautions";
import { getRefrigerant } from "#core/domain/refrigerants/catalogue";
import { renderOnRoute } from "../../../../tests/helpers/render-client";
import { apiError, stubFetch } from "../../../../tests/helpers/stub-fetch";
import { setCsrfToken } from "../../../lib/api-client";
import { SystemForm } from "./system-form";
import { readableSource } from "#core/domain/compliance/citations";

const STORE_ID = "1d2c3b4a-5e6f-4a7b-8c9d-0e1f2a3b4c5d";
// The server's own catalogue answer (GET /api/refrigerants) on the AR4 basis.
const CATALOGUE = {
  refrigerants: REFRIGERANTS.map((r) => ({
    ...summarizeRefrigerant(r, { bases: ["AR4"], statement: "IPCC AR4 100-year values" }),
    cautions: refrigerantCautions(r),
  })),
};

beforeEach(() => setCsrfToken("csrf-lead"));

function open(massUnit: "kg" | "lb" = "kg") {
  const calls = stubFetch({
    "GET /api/refrigerants": { body: CATALOGUE },
    "POST /api/stores/1d2c3b4a-5e6f-4a7b-8c9d-0e1f2a3b4c5d/systems": apiError(
      400,
      "validation_failed",
      "Please check the fields.",
      { refrigerantId: "is not in the catalogue" },
    ),
  });
  renderOnRoute(<SystemForm storeId={STORE_ID} massUnit={massUnit} onDone={() => {}} onCancel={() => {}} />);
  return calls;
}

describe("system form", () => {
  it("shows the picked refrigerant's safety class, GWP with its basis, and the cautions of cautionsFor", async () => {
    open();
    const picker = await screen.findByLabelText("Refrigerant");
    await waitFor(() => expect(screen.getAllByRole("option").length).toBeGreaterThan(10));
    fireEvent.change(picker, { target: { value: "R-290" } });
    // Propane is A3 (ANSI/ASHRAE 34), highly flammable: the flammable caution must show.
    expect(screen.getByText("A3", { selector: "span" })).toBeVisible();
    // The catalogue has no AR4 figure for propane: the form says so rather than show a number.
    expect(screen.getByText(/GWP not known on the company's basis: no GWP for R-290 on AR4/)).toBeVisible();
    for (const c of cautionsFor({ refrigerant: getRefrigerant("R-290") }))
      expect(screen.getByText(c.text, { exact: false })).toBeVisible();
    expect(screen.getByText(/Local codes and certified practice govern/)).toBeVisible();

    // R-744 (CO2) brings the very-high-pressure caution instead.
    fireEvent.change(picker, { target: { value: "R-744" } });
    const co2 = cautionsFor({ refrigerant: getRefrigerant("R-744") });
    expect(co2.some((c) => c.id === "high-pressure-co2")).toBe(true);
    for (const c of co2) expect(screen.getByText(c.text, { exact: false })).toBeVisible();

    // R-404A on AR4 is 3922 (IPCC AR4 GWP-100, as in the EPA's and the EU's published tables).
    fireEvent.change(picker, { target: { value: "R-404A" } });
    const gwp = summarizeRefrigerant(getRefrigerant("R-404A"), {
      bases: ["AR4"],
      statement: "IPCC AR4 100-year values",
    }).gwp!;
    expect(gwp.value).toBe(3922);
    expect(
      screen.getByText(
        (_, el) =>
          el?.tagName === "P" &&
          (el.textContent ?? "").startsWith(`GWP-100 ${gwp.value} on the AR4 basis (${readableSource(gwp.source)})`),
      ),
    ).toBeVisible();
    // Source tags are internal: the form shows citations.
    expect(document.body.textContent).not.toMatch(/\[(S:|M\]|D\])/);
  });

  it("refuses a zero charge with the shared schema's message, before any request", async () => {
    const calls = open();
    fireEvent.change(screen.getByLabelText("System name"), { target: { value: "Rack C" } });
    fireEvent.change(await screen.findByLabelText("Refrigerant"), { target: { value: "R-448A" } });
    fireEvent.change(screen.getByLabelText("Full charge"), { target: { value: "0" } });
    fireEvent.click(screen.getByRole("button", { name: "Add system" }));
    expect(await screen.findByText("Full charge must be more than 0.")).toBeVisible();
    expect(calls.filter((c) => c.method === "POST")).toHaveLength(0);
  });

  it("sends the charge in the user's unit and shows the server's field errors", async () => {
    const calls = open("lb");
    fireEvent.change(screen.getByLabelText("System name"), { target: { value: "Rack C" } });
    await waitFor(() => expect(screen.getAllByRole("option").length).toBeGreaterThan(10));
    fireEvent.change(screen.getByLabelText("Refrigerant"), { target: { value: "R-448A" } });
    fireEvent.change(screen.getByLabelText("Full charge"), { target: { value: "250" } });
    fireEvent.click(screen.getByRole("button", { name: "Add system" }));
    expect(await screen.findByText("Refrigerant is not in the catalogue.")).toBeVisible();
    const post = calls.find((c) => c.method === "POST")!;
    expect(post.body).toMatchObject({
      name: "Rack C",
      refrigerantId: "R-448A",
      fullCharge: { value: 250, unit: "lb" },
      applianceType: "commercial-refrigeration",
      automaticLeakDetection: false,
    });
  });
});
