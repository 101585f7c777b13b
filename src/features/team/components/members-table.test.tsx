import { fireEvent, screen, waitFor } from "@testing-library/react";
import { beforeEach, describe, expect, it } from "vitest";
import type { Member } from "#core/contracts/members";
import { renderOnRoute } from "../../../../tests/helpers/render-client";
import { USER_ID } from "../../../../tests/helpers/session-fixtures";
import { apiError, stubFetch } from "../../../../tests/helpers/stub-fetch";
import { setCsrfToken } from "../../../lib/api-client";
import { MembersTable } from "./members-table";

const STORES = [{ id: "1d2c3b4a-5e6f-4a7b-8c9d-0e1f2a3b4c5d", name: "Maple Street Market" }];

const owner: Member = {
  membershipId: "aa11bb22-cc33-4d44-8e55-ff6677889900",
  userId: USER_ID,
  name: "Ines Varga",
  email: "ines.varga@northfield.example",
  role: "owner",
  storeIds: [],
  joinedAt: "2026-01-05T08:00:00.000Z",
};
const contact: Member = {
  membershipId: "bb22cc33-dd44-4e55-9f66-007788990011",
  userId: "cc33dd44-ee55-4f66-a077-118899001122",
  name: "Dana Okafor",
  email: "dana.okafor@maplestreet.example",
  role: "store-contact",
  storeIds: [STORES[0]!.id],
  joinedAt: "2026-03-10T08:00:00.000Z",
};

const table = (canManage: boolean) => (
  <MembersTable
    members={[owner, contact]}
    stores={STORES}
    canManage={canManage}
    currentUserId={USER_ID}
    companyName="Northfield Cold Care"
  />
);

beforeEach(() => setCsrfToken("csrf-owner"));

describe("members table", () => {
  it("lists members with their role and, for store contacts, their stores", () => {
    stubFetch({});
    renderOnRoute(table(false), { path: "/team" });
    expect(screen.getByText("Ines Varga (you)")).toBeVisible();
    expect(screen.getByText("Maple Street Market")).toBeVisible();
    expect(screen.getByText("Store contact")).toBeVisible();
    expect(screen.queryByRole("button", { name: /Change role/ })).toBeNull();
    expect(screen.queryByRole("button", { name: /Remove/ })).toBeNull();
  });

  it("lets an owner change a role in place", async () => {
    const calls = stubFetch({
      [`PATCH /api/team/members/${contact.membershipId}`]: { body: { ...contact, role: "technician", storeIds: [] } },
    });
    renderOnRoute(table(true), { path: "/team" });
    fireEvent.click(screen.getByRole("button", { name: "Change role of Dana Okafor" }));
    fireEvent.change(screen.getByLabelText("Role of Dana Okafor"), { target: { value: "technician" } });
    fireEvent.click(screen.getByRole("button", { name: "Save role" }));

    await waitFor(() => expect(calls.find((c) => c.method === "PATCH")).toBeTruthy());
    expect(calls.find((c) => c.method === "PATCH")!.body).toEqual({ role: "technician", storeIds: [] });
    await waitFor(() => expect(screen.queryByLabelText("Role of Dana Okafor")).toBeNull());
  });

  it("asks before removing and shows the server's refusal for the last owner", async () => {
    const calls = stubFetch({
      [`DELETE /api/team/members/${owner.membershipId}`]: apiError(
        409,
        "conflict",
        "The company must keep at least one owner.",
      ),
    });
    renderOnRoute(table(true), { path: "/team" });
    fireEvent.click(screen.getByRole("button", { name: "Remove Ines Varga" }));
    expect(calls).toHaveLength(0);
    expect(screen.getByText(/lose access to its stores and records/)).toBeVisible();
    fireEvent.click(screen.getByRole("button", { name: "Yes, remove Ines Varga" }));

    expect((await screen.findByRole("alert")).textContent).toBe("The company must keep at least one owner.");
    expect(calls.filter((c) => c.method === "DELETE")).toHaveLength(1);
  });

  it("keeps the member when the confirm is declined", () => {
    const calls = stubFetch({});
    renderOnRoute(table(true), { path: "/team" });
    fireEvent.click(screen.getByRole("button", { name: "Remove Dana Okafor" }));
    fireEvent.click(screen.getByRole("button", { name: "Keep" }));
    expect(screen.queryByText(/lose access/)).toBeNull();
    expect(calls).toHaveLength(0);
  });
});
