import { fireEvent, screen } from "@testing-library/react";
import { beforeEach, describe, expect, it } from "vitest";
import { PRODUCT_READINGS } from "#core/domain/compliance/readings";
import { renderOnRoute } from "../../../../tests/helpers/render-client";
import { stubFetch } from "../../../../tests/helpers/stub-fetch";
import { setCsrfToken } from "../../../lib/api-client";
import { ReadingsSection } from "./readings-section";

// Two of the product's own readings (core/domain/compliance/readings.ts), the first already accepted.
const [first, second] = PRODUCT_READINGS;
const list = (acceptedSecond: boolean) => ({
  profileId: "us-federal",
  profileName: "US federal",
  readings: [
    { ...first, accepted: { by: "Ines Marlow", at: "2026-11-02T09:00:00.000Z", note: "" } },
    {
      ...second,
      accepted: acceptedSecond ? { by: "Ines Marlow", at: "2026-12-05T10:00:00.000Z", note: "" } : null,
    },
  ],
});

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
    expect(screen.queryByRole("button", { name: /Accept/ })).toBeNull();
  });
});
