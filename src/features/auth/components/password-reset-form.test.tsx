import { fireEvent, screen } from "@testing-library/react";
import { beforeEach, describe, expect, it } from "vitest";
import { renderOnRoute } from "../../../../tests/helpers/render-client";
import { apiError, stubFetch } from "../../../../tests/helpers/stub-fetch";
import { setCsrfToken } from "../../../lib/api-client";
import { PasswordResetForm } from "./password-reset-form";

const TOKEN = "r3s3t-t0k3n-abcdefghijklmn";

beforeEach(() => setCsrfToken("csrf-signed-out"));

function choose(password: string, again: string) {
  fireEvent.change(screen.getByLabelText("New password"), { target: { value: password } });
  fireEvent.change(screen.getByLabelText("New password again"), { target: { value: again } });
  fireEvent.click(screen.getByRole("button", { name: "Save new password" }));
}

describe("password reset form", () => {
  it("sends the token from the link with the new password", async () => {
    const calls = stubFetch({ "POST /api/auth/password-reset/confirm": { status: 204 } });
    renderOnRoute(<PasswordResetForm token={TOKEN} />, {
      path: "/reset-password/:token",
      url: `/reset-password/${TOKEN}`,
    });
    choose("walk-in freezer 7", "walk-in freezer 7");
    expect(await screen.findByText("Password changed")).toBeVisible();
    expect(calls[0]!.body).toEqual({ token: TOKEN, password: "walk-in freezer 7" });
  });

  it("says when the link is no longer valid", async () => {
    stubFetch({
      "POST /api/auth/password-reset/confirm": apiError(400, "validation_failed", "Some fields need attention.", {
        token: "is not a valid reset link",
      }),
    });
    renderOnRoute(<PasswordResetForm token={TOKEN} />, {
      path: "/reset-password/:token",
      url: `/reset-password/${TOKEN}`,
    });
    choose("walk-in freezer 7", "walk-in freezer 7");
    expect((await screen.findByRole("alert")).textContent).toMatch(/This reset link is not valid/);
  });

  it("checks length and the repeat before sending", async () => {
    const calls = stubFetch({});
    renderOnRoute(<PasswordResetForm token={TOKEN} />, {
      path: "/reset-password/:token",
      url: `/reset-password/${TOKEN}`,
    });
    choose("short", "short");
    expect(await screen.findByText("New password must be at least 10 characters.")).toBeVisible();
    choose("long enough now", "long enough naw");
    expect(await screen.findByText("New password again does not match the first one.")).toBeVisible();
    expect(calls).toHaveLength(0);
  });
});
