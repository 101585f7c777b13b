import { fireEvent, screen, waitFor } from "@testing-library/react";
import { beforeEach, describe, expect, it } from "vitest";
import { renderOnRoute } from "../../../../tests/helpers/render-client";
import { stubFetch } from "../../../../tests/helpers/stub-fetch";
import { setCsrfToken } from "../../../lib/api-client";
import { DetectorForm } from "./detector-form";

beforeEach(() => setCsrfToken("csrf-lead"));

const saved = (body: Record<string, unknown>) => ({
  status: 201,
  body: { id: "8a1b2c3d-4e5f-4a6b-9c7d-0e1f2a3b4c5d", archivedAt: null, checkDueOn: null, overdue: false, ...body },
});

function fillLevel(i: number, name: string, from: string, to: string) {
  fireEvent.change(screen.getByLabelText(`Level ${i} name`), { target: { value: name } });
  fireEvent.change(screen.getByLabelText(`Level ${i} from (ppm)`), { target: { value: from } });
  fireEvent.change(screen.getByLabelText(`Level ${i} up to (ppm)`), { target: { value: to } });
}

// Invented LED levels of a detector without a ppm display.
describe("detector form: level scale", () => {
  it("marks an overlapping band by its field and sends nothing; a sound scale is sent as ppm bands", async () => {
    const calls = stubFetch({ "POST /api/detectors": (r) => saved(r.body as Record<string, unknown>) });
    renderOnRoute(<DetectorForm existing={null} onDone={() => {}} />);
    fireEvent.change(screen.getByLabelText("Name"), { target: { value: "LED sniffer" } });
    fireEvent.click(screen.getByRole("button", { name: "Add a level" }));
    fireEvent.click(screen.getByRole("button", { name: "Add a level" }));
    fillLevel(1, "Low", "3", "15");
    fillLevel(2, "High", "10", "");
    fireEvent.click(screen.getByRole("button", { name: "Add detector" }));
    // The field says why; the summary above the form says which field and why.
    expect(await screen.findByRole("alert")).toHaveTextContent(
      /^Please correct: Level 2 min ppm must not overlap level 1 \(up to 15 ppm\)/,
    );
    expect(screen.getByLabelText("Level 2 from (ppm)").getAttribute("aria-invalid")).toBe("true");
    expect(calls.filter((c) => c.method === "POST")).toHaveLength(0);

    fillLevel(2, "High", "15", "");
    fireEvent.click(screen.getByRole("button", { name: "Add detector" }));
    await waitFor(() => expect(calls.filter((c) => c.method === "POST")).toHaveLength(1));
    expect((calls.find((c) => c.method === "POST")!.body as { levelScale: unknown }).levelScale).toEqual([
      { level: "Low", minPpm: 3, maxPpm: 15 },
      { level: "High", minPpm: 15, maxPpm: null },
    ]);
  });

  it("sends no scale when no level is set (a detector with a ppm display)", async () => {
    const calls = stubFetch({ "POST /api/detectors": (r) => saved(r.body as Record<string, unknown>) });
    renderOnRoute(<DetectorForm existing={null} onDone={() => {}} />);
    fireEvent.change(screen.getByLabelText("Name"), { target: { value: "IR unit" } });
    fireEvent.click(screen.getByRole("button", { name: "Add detector" }));
    await waitFor(() => expect(calls.filter((c) => c.method === "POST")).toHaveLength(1));
    expect((calls.find((c) => c.method === "POST")!.body as { levelScale: unknown }).levelScale).toBeNull();
  });
});
