import { render, screen, within } from "@testing-library/react";
import { describe, expect, it } from "vitest";
import { SweepSummaryPlot } from "./sweep-summary-plot";

const sweep = (id: string, startedAt: string, over: Partial<Parameters<typeof SweepSummaryPlot>[0]["sweeps"][0]>) => ({
  id,
  startedAt,
  technicianName: "Ines Varga",
  readingCount: 120,
  peakPpm: 12.5,
  peakAtLeast: false,
  suspects: 2,
  findings: 0,
  confirmed: 0,
  ...over,
});

describe("sweep summary plot", () => {
  it("titles the plot, says what is not analysed yet, and lists the same figures as a table", () => {
    render(
      <SweepSummaryPlot
        numberFormat="1,234.5"
        timeZone="America/Chicago"
        sweeps={[
          sweep("00000000-0000-4000-8000-000000000001", "2026-10-04T13:00:00Z", { findings: 2, confirmed: 1 }),
          sweep("00000000-0000-4000-8000-000000000002", "2026-11-04T13:00:00Z", {
            suspects: null,
            peakPpm: 100,
            peakAtLeast: true,
          }),
        ]}
      />,
    );
    const plot = screen.getByRole("figure", { name: "The last 2 sweeps" });
    expect(within(plot).getByText(/of them 1 confirmed/)).toBeInTheDocument();
    expect(within(plot).getByText(/1 not analysed as they stand yet/)).toBeInTheDocument();
    const rows = within(plot)
      .getAllByRole("row")
      .map((r) => [...r.querySelectorAll("td")].map((c) => c.textContent));
    // times in the store's zone (America/Chicago is UTC−5 in October under daylight time, UTC−6 after the first Sunday of November; IANA tz database)
    expect(rows[1]).toEqual(["4 Oct 2026, 08:00 GMT-5", "Ines Varga", "2", "2", "1", "12.5 ppm"]);
    expect(rows[2]).toEqual(["4 Nov 2026, 07:00 GMT-6", "Ines Varga", "not analysed yet", "0", "0", "≥ 100 ppm"]);
  });
});
