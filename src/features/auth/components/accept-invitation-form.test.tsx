import { fireEvent, screen, waitFor } from "@testing-library/react";
import { beforeEach, describe, expect, it, vi } from "vitest";
import { renderOnRoute } from "../../../../tests/helpers/render-client";
import { sessionFor } from "../../../../tests/helpers/session-fixtures";
import { stubFetch } from "../../../../tests/helpers/stub-fetch";
import { setCsrfToken } from "../../../lib/api-client";
import { AcceptInvitationForm } from "./accept-invitation-form";

const TOKEN = "Zq81x0pLk2abcdefghijKLMNOP";
const preview = {
  companyName: "Northfield Cold Care",
  email: "sam.reyes@northfield.example",
  role: "technician" as const,
};

beforeEach(() => setCsrfToken("csrf-signed-out"));

describe("accept invitation form", () => {
  it("shows the company, role and e-mail of the invitation", () => {
    stubFetch({});
    renderOnRoute(
      <AcceptInvitationForm token={TOKEN} preview={{ ...preview, hasAccount: false }} onAccepted={() => {}} />,
      { path: "/invite/:token", url: `/invite/${TOKEN}` },
    );
    expect(screen.getByText("Northfield Cold Care")).toBeVisible();
    expect(screen.getByText("Technician")).toBeVisible();
    expect(screen.getByText("sam.reyes@northfield.example")).toBeVisible();
  });

  it("asks a newcomer for a name and a new password of at least 10 characters, typed twice", async () => {
    const calls = stubFetch({ [`POST /api/invitations/${TOKEN}/accept`]: { body: sessionFor("technician") } });
    const onAccepted = vi.fn();
    renderOnRoute(
      <AcceptInvitationForm token={TOKEN} preview={{ ...preview, hasAccount: false }} onAccepted={onAccepted} />,
      { path: "/invite/:token", url: `/invite/${TOKEN}` },
    );
    fireEvent.change(screen.getByLabelText("New password"), { target: { value: "short" } });
    fireEvent.change(screen.getByLabelText("New password again"), { target: { value: "shorter" } });
    fireEvent.click(screen.getByRole("button", { name: "Join Northfield Cold Care" }));

    // passwordSchema and personNameSchema in core/contracts/common.ts
    expect(await screen.findByText("Your name is required.")).toBeVisible();
    expect(screen.getByText("New password must be at least 10 characters.")).toBeVisible();
    expect(screen.getByText("New password again does not match the first one.")).toBeVisible();
    expect(calls).toHaveLength(0);

    fireEvent.change(screen.getByLabelText("Your name"), { target: { value: "  Sam Reyes " } });
    fireEvent.change(screen.getByLabelText("New password"), { target: { value: "cold aisle 42" } });
    fireEvent.change(screen.getByLabelText("New password again"), { target: { value: "cold aisle 42" } });
    fireEvent.click(screen.getByRole("button", { name: "Join Northfield Cold Care" }));
    await waitFor(() => expect(onAccepted).toHaveBeenCalledTimes(1));
    expect(calls[0]!.body).toEqual({ name: "Sam Reyes", password: "cold aisle 42" });
  });

  it("asks someone with an account only for their existing password", async () => {
    const calls = stubFetch({ [`POST /api/invitations/${TOKEN}/accept`]: { body: sessionFor("technician") } });
    const onAccepted = vi.fn();
    renderOnRoute(
      <AcceptInvitationForm token={TOKEN} preview={{ ...preview, hasAccount: true }} onAccepted={onAccepted} />,
      { path: "/invite/:token", url: `/invite/${TOKEN}` },
    );
    expect(screen.queryByLabelText("Your name")).toBeNull();
    expect(screen.queryByLabelText("New password")).toBeNull();
    fireEvent.change(screen.getByLabelText("Password"), { target: { value: "old" } });
    fireEvent.click(screen.getByRole("button", { name: "Join Northfield Cold Care" }));
    await waitFor(() => expect(onAccepted).toHaveBeenCalledTimes(1));
    expect(calls[0]!.body).toEqual({ password: "old" });
  });
});
