import { fireEvent, screen, within } from "@testing-library/react";
import { describe, expect, it } from "vitest";
import { renderApp } from "../../../tests/helpers/render-client";
import { sessionFor } from "../../../tests/helpers/session-fixtures";
import { stubFetch } from "../../../tests/helpers/stub-fetch";

const message = (id: string, subject: string, receivedAt: string) => ({
  id,
  from: "Plumeline <no-reply@plumeline.local>",
  to: ["sam.reyes@northfield.example"],
  subject,
  text: `${subject}\nOpen http://127.0.0.1:5180/reset-password/abcdefghijklmnopqrstu`,
  html: null,
  attachments: [],
  receivedAt,
});

describe("outbox page", () => {
  it("lists messages as the server orders them (newest first) and opens one", async () => {
    stubFetch({
      "GET /api/auth/session": { body: sessionFor("engineer") },
      "GET /api/outbox": {
        body: {
          messages: [
            message("6a7b8c9d-0e1f-4a2b-8c3d-4e5f6a7b8c9d", "Choose a new password", "2026-11-30T10:00:00.000Z"),
            message(
              "7b8c9d0e-1f2a-4b3c-9d4e-5f6a7b8c9d0e",
              "You are invited to Northfield Cold Care",
              "2026-11-30T09:00:00.000Z",
            ),
          ],
        },
      },
      "GET /api/outbox/on-its-way": { body: { messages: [] } },
    });
    renderApp("/outbox");
    expect(await screen.findByText("Nothing is waiting: everything sent has arrived below.")).toBeVisible();
    const list = await screen.findByRole("table", { name: "Messages, newest first" });
    const subjects = [...list.querySelectorAll("tbody span.font-bold")].map((el) => el.textContent);
    expect(subjects).toEqual(["Choose a new password", "You are invited to Northfield Cold Care"]);
    // searched by recipient or words in the body; the count says how many are shown
    fireEvent.change(screen.getByLabelText("Search messages"), { target: { value: "invited" } });
    expect([...list.querySelectorAll("tbody span.font-bold")].map((el) => el.textContent)).toEqual([
      "You are invited to Northfield Cold Care",
    ]);
    expect(screen.getByText("Showing 1 of 2.")).toBeInTheDocument();
    fireEvent.change(screen.getByLabelText("Search messages"), { target: { value: "" } });

    fireEvent.click(screen.getByRole("link", { name: /Choose a new password/ }));
    const link = await screen.findByRole("link", {
      name: "http://127.0.0.1:5180/reset-password/abcdefghijklmnopqrstu",
    });
    expect(link.getAttribute("href")).toBe("http://127.0.0.1:5180/reset-password/abcdefghijklmnopqrstu");
  });

  it("lists the mail not delivered yet, a report's PDF being made and a failure with its reason, as a live region", async () => {
    stubFetch({
      "GET /api/auth/session": { body: sessionFor("engineer") },
      "GET /api/outbox": { body: { messages: [] } },
      "GET /api/outbox/on-its-way": {
        body: {
          messages: [
            {
              id: "1f2e3d4c-5b6a-4798-8a7b-6c5d4e3f2a1b",
              kind: "report",
              to: ["area.manager@example.org"],
              subject: "Sweep report: Thistle Lane Grocers, 2 Dec 2026, 07:10",
              state: "preparing",
              attempts: 0,
              error: null,
              queuedAt: "2026-12-02T09:00:00.000Z",
            },
            {
              id: "2a3b4c5d-6e7f-4a8b-9c0d-1e2f3a4b5c6d",
              kind: "invitation",
              to: ["lee.ambrose@example.org"],
              subject: "You are invited to Northfield Cold Care",
              state: "failed",
              attempts: 4,
              error: "The mail server could not be reached.",
              queuedAt: "2026-12-02T08:00:00.000Z",
            },
          ],
        },
      },
    });
    renderApp("/outbox");
    const region = await screen.findByTestId("on-its-way");
    expect(region).toHaveAttribute("aria-live", "polite");
    expect(await within(region).findByText("Making the PDF: the e-mail goes out once it is ready.")).toBeVisible();
    expect(
      within(region).getByText("Not delivered after 4 tries: The mail server could not be reached."),
    ).toBeVisible();
  });

  it("is not there when the installation sends real mail", async () => {
    const calls = stubFetch({ "GET /api/auth/session": { body: sessionFor("owner", { outboxEnabled: false }) } });
    renderApp("/outbox");
    expect(await screen.findByRole("heading", { name: "Page not found" })).toBeVisible();
    expect(calls.some((c) => c.path === "/api/outbox")).toBe(false);
  });
});
