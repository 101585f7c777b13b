import { fireEvent, screen, waitFor } from "@testing-library/react";
import { beforeEach, describe, expect, it, vi } from "vitest";
import { renderOnRoute } from "../../../../tests/helpers/render-client";
import { sessionFor } from "../../../../tests/helpers/session-fixtures";
import { apiError, stubFetch } from "../../../../tests/helpers/stub-fetch";
import { setCsrfToken } from "../../../lib/api-client";
import { SignInForm } from "./sign-in-form";

function fill(email: string, password: string) {
  fireEvent.change(screen.getByLabelText("E-mail"), { target: { value: email } });
  fireEvent.change(screen.getByLabelText("Password"), { target: { value: password } });
  fireEvent.click(screen.getByRole("button", { name: "Sign in" }));
}

beforeEach(() => setCsrfToken("csrf-signed-out"));

describe("sign-in form", () => {
  it("shows the shared schema's field errors and sends nothing when the fields are bad", async () => {
    const calls = stubFetch({});
    renderOnRoute(<SignInForm onSignedIn={() => {}} />, { path: "/sign-in" });
    fill("not-an-address", "");

    // Messages come from signInInput in core/contracts/auth.ts, the schema the server uses.
    expect(await screen.findByText("E-mail must be a valid e-mail address.")).toBeVisible();
    expect(screen.getByText("Password is required.")).toBeVisible();
    expect(screen.getByLabelText("E-mail").getAttribute("aria-invalid")).toBe("true");
    expect(document.activeElement).toBe(screen.getByLabelText("E-mail"));
    expect(calls).toHaveLength(0);
  });

  it("shows the server's plain message when sign-in is rate limited", async () => {
    stubFetch({
      "POST /api/auth/sign-in": apiError(
        429,
        "rate_limited",
        "Too many sign-in attempts from here. Try again in 12 minutes.",
      ),
    });
    const onSignedIn = vi.fn();
    renderOnRoute(<SignInForm onSignedIn={onSignedIn} />, { path: "/sign-in" });
    fill("ines.varga@northfield.example", "wrong-password-again");

    const alert = await screen.findByRole("alert");
    expect(alert.textContent).toBe("Too many sign-in attempts from here. Try again in 12 minutes.");
    expect(onSignedIn).not.toHaveBeenCalled();
  });

  it("shows field errors the server sends back", async () => {
    stubFetch({
      "POST /api/auth/sign-in": apiError(400, "validation_failed", "Some fields need attention.", {
        email: "must be at most 254 characters",
      }),
    });
    renderOnRoute(<SignInForm onSignedIn={() => {}} />, { path: "/sign-in" });
    fill("ines.varga@northfield.example", "secret-password");

    expect(await screen.findByText("E-mail must be at most 254 characters.")).toBeVisible();
    expect(document.activeElement).toBe(screen.getByLabelText("E-mail"));
    expect(screen.getByRole("alert").textContent).toBe("Please correct: E-mail must be at most 254 characters.");
  });

  it("says plainly when the e-mail and password do not match", async () => {
    stubFetch({ "POST /api/auth/sign-in": apiError(401, "invalid_credentials", "Invalid e-mail or password.") });
    renderOnRoute(<SignInForm onSignedIn={() => {}} />, { path: "/sign-in" });
    fill("ines.varga@northfield.example", "not-the-password");
    expect((await screen.findByRole("alert")).textContent).toMatch(/do not match an account/);
  });

  it("sends the trimmed, lower-cased e-mail with the CSRF token and reports success", async () => {
    const calls = stubFetch({ "POST /api/auth/sign-in": { body: sessionFor("owner") } });
    const onSignedIn = vi.fn();
    renderOnRoute(<SignInForm onSignedIn={onSignedIn} />, { path: "/sign-in" });
    fill("  Ines.Varga@Northfield.example ", "correct horse battery");

    await waitFor(() => expect(onSignedIn).toHaveBeenCalledTimes(1));
    expect(calls[0]!.body).toEqual({ email: "ines.varga@northfield.example", password: "correct horse battery" });
    expect(calls[0]!.headers["x-csrf-token"]).toBe("csrf-signed-out");
  });
});
