import { fireEvent, screen, within } from "@testing-library/react";
import { beforeEach, describe, expect, it } from "vitest";
import { PRODUCT_READINGS } from "#core/domain/compliance/readings";
import { renderOnRoute } from "../../../../tests/helpers/render-client";
import { stubFetch } from "../../../../tests/helpers/stub-fetch";
import { setCsrfToken } from "../../../lib/api-client";
import { ReadingsSection } from "./readings-section";

// Two of the product's own readings (core/domain/compliance/readings.ts), the first already accepted.
const [first, second] = PRODUCT_READINGS;
const firstAccepted = { by: "Ines Marlow", at: "2026-11-02T09:00:00.000Z", note: "" };
type Entry = { kind: "accepted" | "withdrawn"; by: string; at: string; note: string };
const acceptedEntry: Entry = { kind: "accepted", ...firstAccepted };
const list = (acceptedSecond: boolean) => ({
  profileId: "us-federal",
  profileName: "US federal",
  readings: [
    { ...first, accepted: firstAccepted as typeof firstAccepted | null, history: [acceptedEntry] },
    {
      ...second,
      accepted: acceptedSecond ? { by: "Ines Marlow", at: "2026-12-05T10:00:00.000Z", note: "" } : null,
      history: (acceptedSecond
        ? [{ kind: "accepted", by: "Ines Marlow", at: "2026-12-05T10:00:00.000Z", note: "" }]
        : []) as Entry[],
    },
  ],
});
const REASON = "Counsel reads the clock from the day the rate was learned";
const withdrawnFirst = () => {
  const l = list(false);
  l.readings[0] = {
    ...l.readings[0],
    accepted: null as unknown as typeof firstAccepted,
    history: [
      acceptedEntry,
      { kind: "withdrawn" as const, by: "Ines Marlow", at: "2026-12-05T11:00:00.000Z", note: REASON },
    ],
  };
  return l;
};

beforeEach(() => setCsrfToken("csrf-owner"));

describe("readings section", () => {
  it("shows who accepted a reading and when, and lets the owner accept the others", async () => {
    const calls = stubFetch({
      "GET /api/compliance/readings": { body: list(false) },
      "POST /api/compliance/readings/accept": { body: list(true) },
    });
    renderOnRoute(<ReadingsSection canAccept />);
    expect(await screen.findByText("Accepted by Ines Marlow on 2026-11-02.")).toBeVisible();
    fireEvent.click(screen.getByRole("button", { name: `Accept: ${second.text}` }));
    expect(await screen.findByText("Accepted by Ines Marlow on 2026-12-05.")).toBeVisible();
    expect(calls.find((c) => c.method === "POST")!.body).toEqual({ text: second.text, note: "" });
  });

  it("offers no button to someone who may not accept", async () => {
    stubFetch({ "GET /api/compliance/readings": { body: list(false) } });
    renderOnRoute(<ReadingsSection />);
    expect(await screen.findByText("Not accepted by the owner yet.")).toBeVisible();
    expect(screen.queryByRole("button", { name: /Accept|Withdraw/ })).toBeNull();
  });

  it("lets the owner withdraw an acceptance with a reason, then shows it not accepted with both in its history", async () => {
    const calls = stubFetch({
      "GET /api/compliance/readings": { body: list(false) },
      "POST /api/compliance/readings/withdraw": { body: withdrawnFirst() },
    });
    renderOnRoute(<ReadingsSection canAccept />);
    fireEvent.click(await screen.findByRole("button", { name: `Withdraw acceptance: ${first.text}` }));
    // No reason: the field says so and nothing is sent.
    fireEvent.click(screen.getByRole("button", { name: "Withdraw" }));
    expect(await screen.findByText("Why the acceptance is withdrawn is required.")).toBeVisible();
    expect(calls.filter((c) => c.method === "POST")).toHaveLength(0);

    fireEvent.change(screen.getByLabelText(/Why the acceptance is withdrawn/), { target: { value: REASON } });
    fireEvent.click(screen.getByRole("button", { name: "Withdraw" }));
    const item = (await screen.findByRole("button", { name: `Accept: ${first.text}` })).closest("li")!;
    expect(calls.find((c) => c.method === "POST")!.body).toEqual({ text: first.text, reason: REASON });
    fireEvent.click(within(item).getByText("History (2)"));
    expect(within(item).getByText("Accepted by Ines Marlow on 2026-11-02.")).toBeVisible();
    expect(within(item).getByText(`Withdrawn by Ines Marlow on 2026-12-05: ${REASON}.`)).toBeVisible();
  });
});
