import { fireEvent, screen, waitFor } from "@testing-library/react";
import { beforeEach, describe, expect, it, vi } from "vitest";
import { renderOnRoute } from "../../../../tests/helpers/render-client";
import { sessionFor } from "../../../../tests/helpers/session-fixtures";
import { stubFetch } from "../../../../tests/helpers/stub-fetch";
import { setCsrfToken } from "../../../lib/api-client";
import { ProfileForm } from "./profile-form";

const user = { ...sessionFor("technician").user!, lengthUnit: "ft-in" as const, massUnit: null };

beforeEach(() => setCsrfToken("csrf-tech"));

describe("profile form", () => {
  it("names the company default and starts from the person's own choice", () => {
    stubFetch({});
    renderOnRoute(
      <ProfileForm user={user} companyDefaults={{ lengthUnit: "m", massUnit: "kg" }} onSaved={() => {}} />,
      { path: "/profile" },
    );
    expect((screen.getByLabelText("Length unit") as HTMLSelectElement).value).toBe("ft-in");
    expect((screen.getByLabelText("Mass unit") as HTMLSelectElement).value).toBe("company-default");
    expect(screen.getByRole("option", { name: "Company default (kg)" })).toBeVisible();
    expect(screen.getByRole("option", { name: "Company default (metres)" })).toBeVisible();
  });

  it("sends null for 'company default' and a unit for an override", async () => {
    const calls = stubFetch({ "PATCH /api/profile": { body: sessionFor("technician") } });
    const onSaved = vi.fn();
    renderOnRoute(<ProfileForm user={user} onSaved={onSaved} />, { path: "/profile" });
    fireEvent.change(screen.getByLabelText("Length unit"), { target: { value: "company-default" } });
    fireEvent.change(screen.getByLabelText("Mass unit"), { target: { value: "lb" } });
    fireEvent.click(screen.getByRole("button", { name: "Save profile" }));

    await waitFor(() => expect(onSaved).toHaveBeenCalledTimes(1));
    expect(calls[0]!.body).toEqual({ name: "Ines Varga", lengthUnit: null, massUnit: "lb" });
  });

  it("refuses an empty name with the shared schema's message", async () => {
    const calls = stubFetch({});
    renderOnRoute(<ProfileForm user={user} onSaved={() => {}} />, { path: "/profile" });
    fireEvent.change(screen.getByLabelText("Name"), { target: { value: "   " } });
    fireEvent.click(screen.getByRole("button", { name: "Save profile" }));
    // personNameSchema in core/contracts/common.ts trims before checking
    expect(await screen.findByText("Name is required.")).toBeVisible();
    expect(calls).toHaveLength(0);
  });
});
