import { fireEvent, screen, waitFor, within } from "@testing-library/react";
import { describe, expect, it } from "vitest";
import type { Role } from "#core/domain/roles";
import { renderApp } from "../../../tests/helpers/render-client";
import { COMPANY_B, sessionFor, signedOutSession } from "../../../tests/helpers/session-fixtures";
import { stubFetch } from "../../../tests/helpers/stub-fetch";

async function navLabels() {
  const nav = await screen.findByRole("navigation", { name: "Main" });
  return within(nav)
    .getAllByRole("link")
    .map((link) => link.textContent);
}

// Expected menus follow the role table in docs/product.md and the grants in core/domain/roles.ts.
const cases: { role: Role; outboxEnabled: boolean; expected: string[] }[] = [
  {
    role: "owner",
    outboxEnabled: true,
    expected: ["Today", "Stores", "Walk", "Detectors", "Team", "Company settings", "Outbox", "Help"],
  },
  {
    role: "owner",
    outboxEnabled: false,
    expected: ["Today", "Stores", "Walk", "Detectors", "Team", "Company settings", "Help"],
  },
  // Engineers read everything (docs/product.md), detectors included.
  {
    role: "engineer",
    outboxEnabled: true,
    expected: ["Today", "Stores", "Detectors", "Team", "Company settings", "Outbox", "Help"],
  },
  {
    role: "lead-tech",
    outboxEnabled: true,
    expected: ["Today", "Stores", "Walk", "Detectors", "Team", "Company settings", "Help"],
  },
  {
    role: "technician",
    outboxEnabled: true,
    expected: ["Today", "Stores", "Walk", "Detectors", "Team", "Company settings", "Help"],
  },
  { role: "store-contact", outboxEnabled: true, expected: ["Today", "Stores", "Company settings", "Help"] },
];

describe("navigation by role", () => {
  it.each(cases)(
    "shows $role (outbox enabled: $outboxEnabled) exactly $expected",
    async ({ role, outboxEnabled, expected }) => {
      stubFetch({
        "GET /api/auth/session": { body: sessionFor(role, { outboxEnabled }) },
        "GET /api/stores": { body: { stores: [] } },
      });
      renderApp("/");
      expect(await navLabels()).toEqual(expected);
    },
  );

  it("offers a company switcher only to people with several memberships", async () => {
    const calls = stubFetch({
      "GET /api/auth/session": { body: sessionFor("owner", { twoCompanies: true }) },
      "GET /api/stores": { body: { stores: [] } },
      "POST /api/auth/switch-company": {
        body: { ...sessionFor("owner", { twoCompanies: true, csrfToken: "csrf-b" }), activeCompanyId: COMPANY_B },
      },
    });
    renderApp("/stores");
    const switcher = await screen.findByLabelText("Company");
    fireEvent.change(switcher, { target: { value: COMPANY_B } });
    await waitFor(() =>
      expect(calls.some((c) => c.method === "POST" && c.path === "/api/auth/switch-company")).toBe(true),
    );
    const post = calls.find((c) => c.path === "/api/auth/switch-company")!;
    expect(post.body).toEqual({ companyId: COMPANY_B });
    await waitFor(() => expect(screen.getByRole("combobox", { name: "Company" })).toHaveProperty("value", COMPANY_B));
    // The first company's store list is dropped and read again for the new company.
    await waitFor(() => expect(calls.filter((c) => c.path === "/api/stores")).toHaveLength(2));
    const switchAt = calls.findIndex((c) => c.path === "/api/auth/switch-company");
    expect(calls.findLastIndex((c) => c.path === "/api/stores")).toBeGreaterThan(switchAt);
  });

  it("shows the company name without a switcher for a single membership", async () => {
    stubFetch({
      "GET /api/auth/session": { body: sessionFor("technician") },
      "GET /api/stores": { body: { stores: [] } },
    });
    renderApp("/");
    expect(await screen.findByText("Northfield Cold Care")).toBeVisible();
    expect(screen.queryByLabelText("Company")).toBeNull();
  });

  it("hides the Team page itself from a store contact who types its address", async () => {
    const calls = stubFetch({ "GET /api/auth/session": { body: sessionFor("store-contact") } });
    renderApp("/team");
    expect(await screen.findByRole("heading", { name: "Page not found" })).toBeVisible();
    expect(calls.some((c) => c.path === "/api/team")).toBe(false);
  });
});

describe("route guard", () => {
  it("sends a signed-out person to sign-in and back to where they were going", async () => {
    let session = signedOutSession();
    stubFetch({
      "GET /api/auth/session": () => ({ body: session }),
      "POST /api/auth/sign-in": () => {
        session = sessionFor("owner");
        return { body: session };
      },
      "GET /api/company/settings": {
        body: {
          name: "Northfield Cold Care",
          lengthUnit: "m",
          massUnit: "kg",
          ruleProfile: "eu-fgas",
          leakRateMethod: "annualizing",
          detectorCheckIntervalDays: 30,
        },
      },
    });
    const { router } = renderApp("/settings");
    expect(await screen.findByRole("heading", { name: "Sign in" })).toBeVisible();
    expect(router.state.location.pathname).toBe("/sign-in");
    expect(router.state.location.search).toBe("?next=%2Fsettings");

    fireEvent.change(screen.getByLabelText("E-mail"), { target: { value: "ines.varga@northfield.example" } });
    fireEvent.change(screen.getByLabelText("Password"), { target: { value: "correct horse battery" } });
    fireEvent.click(screen.getByRole("button", { name: "Sign in" }));

    expect(await screen.findByRole("heading", { name: "Company settings" })).toBeVisible();
    expect(router.state.location.pathname).toBe("/settings");
  });

  it("signs out and lands on a plain sign-in page", async () => {
    let session = sessionFor("owner");
    const calls = stubFetch({
      "GET /api/auth/session": () => ({ body: session }),
      "GET /api/team": { body: { members: [], invitations: [] } },
      "GET /api/stores": { body: { stores: [] } },
      "POST /api/auth/sign-out": () => {
        session = signedOutSession("csrf-after");
        return { body: session };
      },
    });
    const { router } = renderApp("/team");
    fireEvent.click(await screen.findByRole("button", { name: "Sign out" }));
    expect(await screen.findByRole("heading", { name: "Sign in" })).toBeVisible();
    await waitFor(() => expect(router.state.location.search).toBe(""));
    expect(calls.find((c) => c.path === "/api/auth/sign-out")!.headers["x-csrf-token"]).toBe("csrf-signed-in");
  });

  it("tells a signed-in person without any membership what to do", async () => {
    stubFetch({
      "GET /api/auth/session": { body: { ...sessionFor("owner"), memberships: [], activeCompanyId: null } },
    });
    renderApp("/");
    expect(await screen.findByRole("heading", { name: "You are not a member of any company" })).toBeVisible();
    expect(screen.getByRole("button", { name: "Sign out" })).toBeVisible();
    expect(screen.queryByRole("navigation", { name: "Main" })).toBeNull();
  });

  it("shows the 404 page for an unknown address inside the app", async () => {
    stubFetch({ "GET /api/auth/session": { body: sessionFor("owner") } });
    renderApp("/no-such-page");
    expect(await screen.findByRole("heading", { name: "Page not found" })).toBeVisible();
    expect(screen.getByRole("navigation", { name: "Main" })).toBeVisible();
  });
});
