import { render, screen } from "@testing-library/react";
import { describe, expect, it } from "vitest";
import { AuditTrail } from "./audit-trail";

const store = { id: "0b9c7d1e-1111-4222-8333-944455566677", name: "Harrowgate Market", timeZone: "America/Chicago" };

describe("the audit trail on the records page", () => {
  it("reads in the store's time with its zone, days in the summary as every other day, the UTC instant kept", () => {
    render(
      <AuditTrail
        r={{
          store,
          audit: [
            {
              // 02:05 UTC on 3 Mar is 20:05 on 2 Mar in Chicago (CST, UTC−6; IANA tz database).
              at: "2026-03-03T02:05:00.000Z",
              by: "Ines Marlow",
              action: "system-revised",
              summary: "Retrofit from 2026-03-02: refrigerant R-22 → R-448A; reason: phase-out",
            },
          ],
        }}
      />,
    );
    const item = screen.getByRole("listitem");
    expect(item.textContent).toBe(
      "2 Mar 2026, 20:05 GMT-6, Ines Marlow: Retrofit from 2 Mar 2026: refrigerant R-22 → R-448A; reason: phase-out",
    );
    expect(item.querySelector("time")?.getAttribute("datetime")).toBe("2026-03-03T02:05:00.000Z");
    expect(screen.getByRole("list", { name: "Audit trail" }).textContent).not.toMatch(/UTC|T\d\d:\d\d|\d{4}-\d\d-\d\d/);
  });
});
