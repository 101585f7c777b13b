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

const SYSTEM_ID = "5b6c7d8e-9f0a-4b1c-8d2e-3f4a5b6c7d8e";
const rack = {
  id: SYSTEM_ID,
  storeId: STORE_ID,
  name: "Rack A",
  refrigerantId: "R-448A",
  // 1,200 lb × 0.45359237 kg/lb (NIST SP 811, appendix B.8)
  fullChargeKg: 1200 * 0.45359237,
  applianceType: "commercial-refrigeration" as const,
  automaticLeakDetection: false,
  hermeticallySealed: false,
  inServiceOn: "2025-03-01",
  retired: null,
  hasRecords: true,
  refrigerant: CATALOGUE.refrigerants.find((r) => r.id === "R-448A")!,
  cautions: [],
  createdAt: "2025-03-01T12:00:00.000Z",
  updatedAt: "2025-03-01T12:00:00.000Z",
};

function openEdit(canRevise: boolean) {
  const calls = stubFetch({
    "GET /api/refrigerants": { body: CATALOGUE },
    [`POST /api/systems/${SYSTEM_ID}/revisions`]: { status: 201, body: rack },
    [`PATCH /api/systems/${SYSTEM_ID}`]: { body: rack },
  });
  renderOnRoute(
    <SystemForm
      storeId={STORE_ID}
      system={rack}
      massUnit="lb"
      numberFormat="1,234.5"
      canRevise={canRevise}
      onDone={() => {}}
      onCancel={() => {}}
    />,
  );
  return calls;
}

describe("system form: grouped numbers in the company's format", () => {
  it('reads "1,200" as twelve hundred with a decimal point, and echoes what it read', async () => {
    const calls = open("lb");
    fireEvent.change(screen.getByLabelText("System name"), { target: { value: "Rack C" } });
    await waitFor(() => expect(screen.getAllByRole("option").length).toBeGreaterThan(10));
    fireEvent.change(screen.getByLabelText("Refrigerant"), { target: { value: "R-448A" } });
    fireEvent.change(screen.getByLabelText("Full charge"), { target: { value: "1,200" } });
    expect(screen.getByText("Read as 1,200 lb")).toBeVisible();
    fireEvent.click(screen.getByRole("button", { name: "Add system" }));
    await waitFor(() => expect(calls.some((c) => c.method === "POST")).toBe(true));
    expect(calls.find((c) => c.method === "POST")!.body).toMatchObject({ fullCharge: { value: 1200, unit: "lb" } });
  });

  it('reads "1,200" as one point two in a decimal-comma format', async () => {
    const calls = stubFetch({ "GET /api/refrigerants": { body: CATALOGUE }, "POST /api/stores/x/systems": {} });
    renderOnRoute(
      <SystemForm storeId="x" massUnit="kg" numberFormat="1.234,5" onDone={() => {}} onCancel={() => {}} />,
    );
    fireEvent.change(screen.getByLabelText("Full charge"), { target: { value: "1,200" } });
    expect(screen.getByText("Read as 1,2 kg")).toBeVisible();
    fireEvent.change(screen.getByLabelText("Full charge"), { target: { value: "1.200,5" } });
    expect(screen.getByText("Read as 1.200,5 kg")).toBeVisible();
    expect(calls.filter((c) => c.method === "POST")).toHaveLength(0);
  });

  it("refuses digits grouped wrongly with the reason, before any request", async () => {
    const calls = open("lb");
    fireEvent.change(screen.getByLabelText("Full charge"), { target: { value: "12,00" } });
    fireEvent.click(screen.getByRole("button", { name: "Add system" }));
    expect(
      await screen.findByText('Full charge must group thousands in threes: in 1,234.5 the decimal mark is ".".'),
    ).toBeVisible();
    expect(calls.filter((c) => c.method === "POST")).toHaveLength(0);
  });

  it("offers lb first to an lb company", async () => {
    open("lb");
    const unit = screen.getByLabelText("Charge unit") as HTMLSelectElement;
    expect([...unit.options].map((o) => o.value)).toEqual(["lb", "kg"]);
  });
});

describe("system form: editing a dated fact makes a revision", () => {
  it("asks for the day, kind and reason, then posts a revision (docs/decisions/0043-system-revisions.md)", async () => {
    const calls = openEdit(true);
    const charge = screen.getByLabelText("Full charge") as HTMLInputElement;
    expect(charge.value).toBe("1,200");
    expect(screen.queryByLabelText("Reason")).toBeNull();
    fireEvent.change(charge, { target: { value: "1,350" } });
    expect(screen.getByText(/You changed the full charge/)).toBeVisible();
    fireEvent.change(screen.getByLabelText("Takes effect on"), { target: { value: "2026-06-01" } });
    fireEvent.click(screen.getByRole("button", { name: "Save revision" }));
    expect(await screen.findByText("Reason is required.")).toBeVisible();
    expect(calls.filter((c) => c.method !== "GET")).toHaveLength(0);

    fireEvent.change(screen.getByLabelText("Reason"), { target: { value: "Receiver added" } });
    fireEvent.click(screen.getByRole("button", { name: "Save revision" }));
    await waitFor(() => expect(calls.some((c) => c.method === "POST")).toBe(true));
    const post = calls.find((c) => c.method === "POST")!;
    expect(post.path).toBe(`/api/systems/${SYSTEM_ID}/revisions`);
    expect(post.body).toEqual({
      effectiveFrom: "2026-06-01",
      kind: "change",
      reason: "Receiver added",
      fullCharge: { value: 1350, unit: "lb" },
    });
    expect(calls.some((c) => c.method === "PATCH")).toBe(false);
  });

  it("calls a new refrigerant a retrofit by default", async () => {
    openEdit(true);
    await waitFor(() => expect(screen.getAllByRole("option").length).toBeGreaterThan(10));
    fireEvent.change(screen.getByLabelText("Refrigerant"), { target: { value: "R-744" } });
    expect((screen.getByLabelText("Kind of change") as HTMLSelectElement).value).toBe("retrofit");
  });

  it("renames with a plain edit and sends no revision", async () => {
    const calls = openEdit(true);
    fireEvent.change(screen.getByLabelText("System name"), { target: { value: "Rack A (MT)" } });
    fireEvent.click(screen.getByRole("button", { name: "Save system" }));
    await waitFor(() => expect(calls.some((c) => c.method === "PATCH")).toBe(true));
    expect(calls.find((c) => c.method === "PATCH")!.body).toEqual({ name: "Rack A (MT)" });
    expect(calls.some((c) => c.method === "POST")).toBe(false);
  });
});

describe("system form: hermetically sealed (EU, docs/reference/standards.md §2 [S:E1]; decision 0122)", () => {
  it("asks an EU company whether the unit is factory-sealed and labelled, says what that means, and sends it", async () => {
    const calls = stubFetch({
      "GET /api/refrigerants": { body: CATALOGUE },
      [`POST /api/stores/${STORE_ID}/systems`]: apiError(400, "validation_failed", "Please check the fields.", {
        name: "is taken",
      }),
    });
    renderOnRoute(<SystemForm storeId={STORE_ID} massUnit="kg" rules="eu" onDone={() => {}} onCancel={() => {}} />);
    const sealed = screen.getByLabelText("Hermetically sealed (factory-sealed, labelled as such)");
    expect(screen.getByText(/carries a label saying it is hermetically sealed/)).toBeVisible();
    fireEvent.change(screen.getByLabelText("System name"), { target: { value: "Bottle cooler" } });
    await waitFor(() => expect(screen.getAllByRole("option").length).toBeGreaterThan(10));
    fireEvent.change(screen.getByLabelText("Refrigerant"), { target: { value: "R-404A" } });
    fireEvent.change(screen.getByLabelText("Full charge"), { target: { value: "1.9" } });
    fireEvent.click(sealed);
    fireEvent.click(screen.getByRole("button", { name: "Add system" }));
    await screen.findByText("System name is taken.");
    expect(calls.find((c) => c.method === "POST")!.body).toMatchObject({ hermeticallySealed: true });
  });

  it("does not ask a US company", () => {
    stubFetch({ "GET /api/refrigerants": { body: CATALOGUE } });
    renderOnRoute(<SystemForm storeId={STORE_ID} massUnit="lb" onDone={() => {}} onCancel={() => {}} />);
    expect(screen.queryByLabelText(/Hermetically sealed/)).toBeNull();
  });
});
