import { fireEvent, screen, waitFor } from "@testing-library/react";
import { beforeEach, describe, expect, it } from "vitest";
import { renderOnRoute } from "../../../../tests/helpers/render-client";
import { apiError, stubFetch } from "../../../../tests/helpers/stub-fetch";
import { setCsrfToken } from "../../../lib/api-client";
import { InviteForm } from "./invite-form";

const STORES = [
  { id: "1d2c3b4a-5e6f-4a7b-8c9d-0e1f2a3b4c5d", name: "Maple Street Market" },
  { id: "9f8e7d6c-5b4a-4c3d-9e2f-1a0b9c8d7e6f", name: "Riverside Fresh" },
];

function invitationReply(body: { email: string; role: string; storeIds: string[] }) {
  return {
    status: 201,
    body: {
      id: "4e5f6a7b-8c9d-4e0f-a1b2-c3d4e5f6a7b8",
      ...body,
      invitedBy: "Ines Varga",
      createdAt: "2026-11-30T09:00:00.000Z",
      expiresAt: "2026-12-07T09:00:00.000Z",
      acceptedAt: null,
      delivery: {
        mailId: "9a8b7c6d-5e4f-4a3b-8c2d-1e0f9a8b7c6d",
        state: "queued",
        attempts: 0,
        error: null,
        sentAt: null,
      },
    },
  };
}

const storePicker = () => screen.queryByRole("group", { name: "Stores this contact may see" });

beforeEach(() => setCsrfToken("csrf-owner"));

describe("invite form", () => {
  it("shows the store picker only when the role is store contact", () => {
    stubFetch({});
    renderOnRoute(<InviteForm stores={STORES} />, { path: "/team" });
    const role = screen.getByLabelText("Role");

    expect(storePicker()).toBeNull();
    for (const other of ["owner", "lead-tech", "technician", "engineer"]) {
      fireEvent.change(role, { target: { value: other } });
      expect(storePicker()).toBeNull();
    }
    fireEvent.change(role, { target: { value: "store-contact" } });
    expect(storePicker()).not.toBeNull();
    expect(screen.getByLabelText("Maple Street Market")).toBeVisible();
    expect(screen.getByLabelText("Riverside Fresh")).toBeVisible();
  });

  it("refuses a store contact without a store, with inviteInput's message, and sends nothing", async () => {
    const calls = stubFetch({});
    renderOnRoute(<InviteForm stores={STORES} />, { path: "/team" });
    fireEvent.change(screen.getByLabelText("E-mail"), { target: { value: "dana.okafor@maplestreet.example" } });
    fireEvent.change(screen.getByLabelText("Role"), { target: { value: "store-contact" } });
    fireEvent.click(screen.getByRole("button", { name: "Send invitation" }));

    expect(await screen.findByText("A store contact must be given at least one store.")).toBeVisible();
    expect(document.activeElement).toBe(screen.getByLabelText("Maple Street Market"));
    expect(calls).toHaveLength(0);
  });

  it("sends the chosen stores for a store contact", async () => {
    const calls = stubFetch({ "POST /api/team/invitations": (req) => invitationReply(req.body as never) });
    renderOnRoute(<InviteForm stores={STORES} />, { path: "/team" });
    fireEvent.change(screen.getByLabelText("E-mail"), { target: { value: "Dana.Okafor@MapleStreet.example" } });
    fireEvent.change(screen.getByLabelText("Role"), { target: { value: "store-contact" } });
    fireEvent.click(screen.getByLabelText("Riverside Fresh"));
    fireEvent.click(screen.getByRole("button", { name: "Send invitation" }));

    expect(await screen.findByText("Invitation sent to dana.okafor@maplestreet.example")).toBeVisible();
    expect(calls[0]!.body).toEqual({
      email: "dana.okafor@maplestreet.example",
      role: "store-contact",
      storeIds: [STORES[1]!.id],
    });
    expect(calls[0]!.headers["x-csrf-token"]).toBe("csrf-owner");
  });

  it("drops stores picked earlier when the role changes away from store contact", async () => {
    const calls = stubFetch({ "POST /api/team/invitations": (req) => invitationReply(req.body as never) });
    renderOnRoute(<InviteForm stores={STORES} />, { path: "/team" });
    fireEvent.change(screen.getByLabelText("E-mail"), { target: { value: "sam.reyes@northfield.example" } });
    fireEvent.change(screen.getByLabelText("Role"), { target: { value: "store-contact" } });
    fireEvent.click(screen.getByLabelText("Maple Street Market"));
    fireEvent.change(screen.getByLabelText("Role"), { target: { value: "technician" } });
    fireEvent.click(screen.getByRole("button", { name: "Send invitation" }));

    await waitFor(() => expect(calls).toHaveLength(1));
    expect(calls[0]!.body).toEqual({ email: "sam.reyes@northfield.example", role: "technician", storeIds: [] });
  });

  it("shows the server's field errors and conflicts", async () => {
    stubFetch({
      "POST /api/team/invitations": apiError(
        409,
        "conflict",
        "sam.reyes@northfield.example is already a member of this company.",
      ),
    });
    renderOnRoute(<InviteForm stores={STORES} />, { path: "/team" });
    fireEvent.change(screen.getByLabelText("E-mail"), { target: { value: "sam.reyes@northfield.example" } });
    fireEvent.click(screen.getByRole("button", { name: "Send invitation" }));
    expect((await screen.findByRole("alert")).textContent).toBe(
      "sam.reyes@northfield.example is already a member of this company.",
    );
  });
});
