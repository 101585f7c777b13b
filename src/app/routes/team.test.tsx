import { fireEvent, screen, within } from "@testing-library/react";
import { describe, expect, it } from "vitest";
import { renderApp } from "../../../tests/helpers/render-client";
import { sessionFor } from "../../../tests/helpers/session-fixtures";
import { stubFetch } from "../../../tests/helpers/stub-fetch";

const STORE = {
  id: "1d2c3b4a-5e6f-4a7b-8c9d-0e1f2a3b4c5d",
  name: "Maple Street Market",
  address: "14 Maple Street",
  timeZone: "America/Chicago",
  archivedAt: null,
  createdAt: "2026-01-05T15:00:00.000Z",
  updatedAt: "2026-01-05T15:00:00.000Z",
};
const TEAM = {
  members: [
    {
      membershipId: "aa11bb22-cc33-4d44-8e55-ff6677889900",
      userId: "7c1d2e3f-4a5b-4c6d-8e7f-9a0b1c2d3e4f",
      name: "Ines Varga",
      email: "ines.varga@northfield.example",
      role: "owner",
      storeIds: [],
      joinedAt: "2026-01-05T08:00:00.000Z",
    },
  ],
  invitations: [
    {
      id: "4e5f6a7b-8c9d-4e0f-a1b2-c3d4e5f6a7b8",
      email: "sam.reyes@northfield.example",
      role: "technician",
      storeIds: [],
      invitedBy: "Ines Varga",
      createdAt: "2026-11-30T09:00:00.000Z",
      expiresAt: "2099-12-07T09:00:00.000Z",
      acceptedAt: null,
      delivery: {
        mailId: "9a8b7c6d-5e4f-4a3b-8c2d-1e0f9a8b7c6d",
        state: "failed",
        attempts: 9,
        error: "The mail server could not be reached.",
        sentAt: null,
      },
    },
  ],
};

describe("team page", () => {
  it("gives an owner the invite form with the company's stores in the picker", async () => {
    stubFetch({
      "GET /api/auth/session": { body: sessionFor("owner") },
      "GET /api/team": { body: TEAM },
      "GET /api/stores": { body: { stores: [STORE] } },
    });
    renderApp("/team");
    const form = await screen.findByRole("form", { name: "Invite a member" });
    fireEvent.change(within(form).getByLabelText("Role"), { target: { value: "store-contact" } });
    expect(await within(form).findByLabelText("Maple Street Market")).toBeVisible();
    expect(screen.getByRole("button", { name: "Revoke the invitation to sam.reyes@northfield.example" })).toBeVisible();
    expect(screen.getByRole("table", { name: "Pending invitations" }).textContent).toContain("All stores");
    // The invitation e-mail failed: the owner sees why and can send the same invitation again.
    expect(screen.getByRole("table", { name: "Pending invitations" }).textContent).toContain(
      "Not delivered after 9 tries: The mail server could not be reached.",
    );
    expect(
      screen.getByRole("button", { name: "Send the invitation to sam.reyes@northfield.example again" }),
    ).toBeVisible();
  });

  it("shows the owner the security log in words, failed sign-ins marked", async () => {
    stubFetch({
      "GET /api/auth/session": { body: sessionFor("owner") },
      "GET /api/team": { body: TEAM },
      "GET /api/stores": { body: { stores: [STORE] } },
      "GET /api/company/security-log": {
        body: {
          events: [
            {
              id: "0b1c2d3e-4f50-4a61-8b72-c3d4e5f60718",
              kind: "role-changed",
              who: "sam.reyes@northfield.example",
              by: "ines.varga@northfield.example",
              detail: { from: "technician", to: "lead-tech" },
              ip: "203.0.113.7",
              at: "2026-12-02T15:00:00.000Z",
            },
            {
              id: "1c2d3e4f-5061-4b72-8c83-d4e5f6071829",
              kind: "sign-in-failed",
              who: "sam.reyes@northfield.example",
              by: null,
              detail: {},
              ip: "198.51.100.20",
              at: "2026-12-01T15:00:00.000Z",
            },
          ],
        },
      },
    });
    renderApp("/team");
    const events = await screen.findAllByTestId("security-event");
    expect(events.map((e) => e.querySelector("p")?.textContent)).toEqual([
      "ines.varga@northfield.example changed sam.reyes@northfield.example's role from Technician to Lead tech.",
      "Someone tried to sign in as sam.reyes@northfield.example with a wrong password.",
    ]);
    expect(events[0].textContent).toContain("from 203.0.113.7");
  });

  it("shows a technician the members but no invite form and no owner actions", async () => {
    stubFetch({
      "GET /api/auth/session": { body: sessionFor("technician") },
      "GET /api/team": { body: TEAM },
      "GET /api/stores": { body: { stores: [STORE] } },
    });
    renderApp("/team");
    expect(await screen.findByText("ines.varga@northfield.example")).toBeVisible();
    expect(screen.queryByRole("form", { name: "Invite a member" })).toBeNull();
    expect(screen.queryByRole("button", { name: /Revoke|Remove|Change role/ })).toBeNull();
    expect(screen.queryByRole("heading", { name: "Security log" })).toBeNull();
  });
});
