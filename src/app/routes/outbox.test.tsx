import { fireEvent, screen } from "@testing-library/react";
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
    });
    renderApp("/outbox");
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

  it("is not there when the installation sends real mail", async () => {
    const calls = stubFetch({ "GET /api/auth/session": { body: sessionFor("owner", { outboxEnabled: false }) } });
    renderApp("/outbox");
    expect(await screen.findByRole("heading", { name: "Page not found" })).toBeVisible();
    expect(calls.some((c) => c.path === "/api/outbox")).toBe(false);
  });
});
