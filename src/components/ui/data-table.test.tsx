import { fireEvent, render, screen, within } from "@testing-library/react";
import { describe, expect, it } from "vitest";
import { DataTable, type Column } from "./data-table";
import { compareValues, textMatches } from "./data-table-model";

interface Sys {
  id: string;
  name: string;
  refrigerant: string;
  chargeKg: number;
}

const rows: Sys[] = [
  { id: "a", name: "Rack 10 (LT)", refrigerant: "R-448A", chargeKg: 180 },
  { id: "b", name: "Rack 2 (MT)", refrigerant: "R-744", chargeKg: 95 },
  { id: "c", name: "Café condensing unit", refrigerant: "R-448A", chargeKg: 12.5 },
];

const columns: Column<Sys>[] = [
  { header: "System", cell: (s) => s.name, sortValue: (s) => s.name, searchText: (s) => s.name },
  { header: "Refrigerant", cell: (s) => s.refrigerant, filterValue: (s) => s.refrigerant },
  { header: "Full charge", cell: (s) => `${s.chargeKg} kg`, sortValue: (s) => s.chargeKg },
  { header: "", cell: (s) => <button type="button">Edit {s.name}</button> },
];

const names = () =>
  within(screen.getByRole("table"))
    .getAllByRole("row")
    .slice(1)
    .map((r) => r.querySelector("td")?.textContent);

describe("data table", () => {
  it("searches without regard to case or accents, and says how many rows it shows", () => {
    render(<DataTable caption="Systems" columns={columns} rows={rows} rowKey={(s) => s.id} search="Search systems" />);
    fireEvent.change(screen.getByLabelText("Search systems"), { target: { value: "cafe" } });
    expect(names()).toEqual(["Café condensing unit"]);
    expect(screen.getByText("Showing 1 of 3.")).toBeInTheDocument();
    fireEvent.change(screen.getByLabelText("Search systems"), { target: { value: "nothing like it" } });
    expect(screen.getByText("Nothing matches “nothing like it”.")).toBeInTheDocument();
  });

  it("filters by a column's values and sorts by a header, numbers in numeric order", () => {
    render(<DataTable caption="Systems" columns={columns} rows={rows} rowKey={(s) => s.id} />);
    fireEvent.change(screen.getByLabelText("Refrigerant (Systems)"), { target: { value: "R-448A" } });
    expect(names()).toEqual(["Rack 10 (LT)", "Café condensing unit"]);
    fireEvent.change(screen.getByLabelText("Refrigerant (Systems)"), { target: { value: "" } });
    fireEvent.click(screen.getByRole("button", { name: /Full charge/ }));
    expect(names()).toEqual(["Café condensing unit", "Rack 2 (MT)", "Rack 10 (LT)"]);
    expect(screen.getByRole("columnheader", { name: /Full charge/ }).getAttribute("aria-sort")).toBe("ascending");
    // "Rack 2" before "Rack 10": numbers inside names in order
    fireEvent.change(screen.getByLabelText("Sort by (Systems)"), { target: { value: "System:asc" } });
    expect(names()).toEqual(["Café condensing unit", "Rack 2 (MT)", "Rack 10 (LT)"]);
    fireEvent.change(screen.getByLabelText("Sort by (Systems)"), { target: { value: "System:desc" } });
    expect(names()).toEqual(["Rack 10 (LT)", "Rack 2 (MT)", "Café condensing unit"]);
  });

  it("labels each cell with its column for the stacked phone layout", () => {
    render(<DataTable caption="Systems" columns={columns} rows={rows} rowKey={(s) => s.id} />);
    const cells = within(screen.getAllByRole("row")[1]).getAllByRole("cell");
    expect(cells.map((c) => c.getAttribute("data-label"))).toEqual(["System", "Refrigerant", "Full charge", null]);
  });

  it("compares numbers before text and empty last; matches folded text", () => {
    expect([3, "b", null, 1, "a"].sort(compareValues)).toEqual([1, 3, "a", "b", null]);
    expect(textMatches("Ćwikła & Sons", "cwik")).toBe(true);
    expect(textMatches("Dairy 2", "dairy 3")).toBe(false);
  });
});
