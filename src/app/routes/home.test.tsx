import { screen } from "@testing-library/react";
import { describe, expect, it } from "vitest";
import { renderApp } from "../../../tests/helpers/render-client";
import { sessionFor, signedOutSession } from "../../../tests/helpers/session-fixtures";
import { apiError, stubFetch } from "../../../tests/helpers/stub-fetch";

// The server's store shape (core/contracts/stores.ts).
const store = (id: string, name: string, archivedAt: string | null = null) => ({
  id,
  name,
  address: "14 Maple Street, Brookfield",
  timeZone: "America/Chicago",
  archivedAt,
  createdAt: "2026-01-05T15:00:00.000Z",
  updatedAt: "2026-01-05T15:00:00.000Z",
});

describe("stores page", () => {
  it("lists the company's stores with their address and leaves out archived ones", async () => {
    stubFetch({
      "GET /api/auth/session": { body: sessionFor("technician") },
      "GET /api/stores": {
        body: {
          stores: [
            store("1d2c3b4a-5e6f-4a7b-8c9d-0e1f2a3b4c5d", "Maple Street Market"),
            store("9f8e7d6c-5b4a-4c3d-9e2f-1a0b9c8d7e6f", "Old Quay Depot", "2026-06-01T00:00:00.000Z"),
          ],
        },
      },
    });
    renderApp("/");
    expect(await screen.findByText("Maple Street Market")).toBeVisible();
    expect(screen.getByText("14 Maple Street, Brookfield")).toBeVisible();
    expect(screen.queryByText("Old Quay Depot")).toBeNull();
  });

  it("shows an empty state, worded for a store contact, when there are none", async () => {
    stubFetch({
      "GET /api/auth/session": { body: sessionFor("store-contact") },
      "GET /api/stores": { body: { stores: [] } },
    });
    renderApp("/");
    expect(await screen.findByText("No stores yet")).toBeVisible();
    expect(screen.getByText(/No store has been shared with you/)).toBeVisible();
  });

  it("sends someone whose session ran out to sign-in, to come back here", async () => {
    let expired = false;
    stubFetch({
      "GET /api/auth/session": () => ({ body: expired ? signedOutSession() : sessionFor("owner") }),
      "GET /api/stores": () => {
        expired = true;
        return apiError(401, "not_signed_in", "Please sign in.");
      },
    });
    // Owners land on Today at "/": their store list lives at /stores.
    const { router } = renderApp("/stores?view=all");
    expect(await screen.findByRole("heading", { name: "Sign in" })).toBeVisible();
    expect(router.state.location.search).toBe(`?next=${encodeURIComponent("/stores?view=all")}`);
  });
});
