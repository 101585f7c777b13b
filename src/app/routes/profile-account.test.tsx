import { fireEvent, screen, waitFor, within } from "@testing-library/react";
import { describe, expect, it } from "vitest";
import { renderApp } from "../../../tests/helpers/render-client";
import { sessionFor } from "../../../tests/helpers/session-fixtures";
import { apiError, stubFetch } from "../../../tests/helpers/stub-fetch";

const PHONE =
  "Mozilla/5.0 (Linux; Android 14; Pixel 8) AppleWebKit/537.36 (KHTML, like Gecko) Chrome/131.0.0.0 Mobile Safari/537.36";
const LAPTOP = "Mozilla/5.0 (X11; Linux x86_64; rv:133.0) Gecko/20100101 Firefox/133.0";
const session = (id: string, current: boolean, userAgent: string) => ({
  id,
  current,
  signedInAt: "2026-12-01T14:00:00.000Z",
  userAgent,
  expiresAt: "2026-12-31T14:00:00.000Z",
});

describe("your account on the profile page", () => {
  it("changes the password with the current one, and says other devices are signed out", async () => {
    const calls = stubFetch({
      "GET /api/auth/session": { body: sessionFor("technician") },
      "GET /api/profile/sessions": { body: { sessions: [session("a".repeat(22), true, LAPTOP)] } },
      "POST /api/profile/password": ({ body }) =>
        (body as { currentPassword: string }).currentPassword === "right-old-password"
          ? { status: 204 }
          : apiError(400, "validation_failed", "Please check.", {
              currentPassword: "does not match your current password",
            }),
    });
    renderApp("/profile");
    const form = await screen.findByRole("form", { name: "Change your password" });
    const type = (label: string, value: string) =>
      fireEvent.change(within(form).getByLabelText(label), { target: { value } });
    type("Current password", "wrong-old-password");
    type("New password", "a-new-long-password");
    type("New password again", "a-new-long-password");
    fireEvent.click(within(form).getByRole("button", { name: "Change password" }));
    expect(await within(form).findByRole("alert")).toHaveTextContent(
      "Please correct: Current password does not match your current password.",
    );
    expect(within(form).getByLabelText("Current password")).toHaveAttribute("aria-invalid", "true");

    type("Current password", "right-old-password");
    fireEvent.click(within(form).getByRole("button", { name: "Change password" }));
    expect(await within(form).findByText(/Every other device you were signed in on is signed out/)).toBeVisible();
    expect(calls.filter((c) => c.path === "/api/profile/password")).toHaveLength(2);
  });

  it("refuses a mistyped repeat before asking the server", async () => {
    const calls = stubFetch({
      "GET /api/auth/session": { body: sessionFor("technician") },
      "GET /api/profile/sessions": { body: { sessions: [] } },
    });
    renderApp("/profile");
    const form = await screen.findByRole("form", { name: "Change your password" });
    fireEvent.change(within(form).getByLabelText("Current password"), { target: { value: "old-password-1" } });
    fireEvent.change(within(form).getByLabelText("New password"), { target: { value: "a-new-long-password" } });
    fireEvent.change(within(form).getByLabelText("New password again"), { target: { value: "a-new-long-pasword" } });
    fireEvent.click(within(form).getByRole("button", { name: "Change password" }));
    expect(await within(form).findByText(/does not match the new password/)).toBeVisible();
    expect(calls.some((c) => c.path === "/api/profile/password")).toBe(false);
  });

  it("lists where you are signed in and signs the other devices out", async () => {
    let sessions = [session("a".repeat(22), true, LAPTOP), session("b".repeat(22), false, PHONE)];
    const calls = stubFetch({
      "GET /api/auth/session": { body: sessionFor("technician") },
      "GET /api/profile/sessions": () => ({ body: { sessions } }),
      "POST /api/profile/sessions/end-others": () => {
        sessions = sessions.filter((s) => s.current);
        return { status: 204 };
      },
    });
    renderApp("/profile");
    const rows = await screen.findAllByTestId("account-session");
    expect(rows.map((r) => within(r).getByText(/ on /).textContent)).toEqual([
      "Firefox on Linux · this device",
      "Chrome on Android",
    ]);
    fireEvent.click(screen.getByRole("button", { name: "Sign out everywhere else" }));
    await waitFor(() => expect(screen.getAllByTestId("account-session")).toHaveLength(1));
    expect(screen.getByText("You are signed in on this device only.")).toBeVisible();
    expect(calls.filter((c) => c.method === "POST").map((c) => c.path)).toEqual(["/api/profile/sessions/end-others"]);
  });
});
