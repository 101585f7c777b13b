import { render, screen } from "@testing-library/react";
import { describe, expect, it } from "vitest";
import type { OutboxMessage } from "#core/contracts/outbox";
import { OutboxMessageView } from "./outbox-message-view";

const message: OutboxMessage = {
  id: "6a7b8c9d-0e1f-4a2b-8c3d-4e5f6a7b8c9d",
  from: "Plumeline <no-reply@plumeline.local>",
  to: ["dana.okafor@maplestreet.example"],
  subject: "You are invited to Northfield Cold Care",
  text: "Ines Varga invited you.\nAccept: http://127.0.0.1:5180/invite/Zq81x0pLk2",
  html: "<p>Ines Varga invited you.</p><script>window.__ran = true</script>",
  attachments: [{ filename: "sweep-report.pdf", contentType: "application/pdf", size: 20480 }],
  receivedAt: "2026-11-30T09:00:00.000Z",
};

describe("outbox message view", () => {
  it("makes the invitation link clickable and lists attachments", () => {
    render(<OutboxMessageView message={message} />);
    const link = screen.getByRole("link", { name: "http://127.0.0.1:5180/invite/Zq81x0pLk2" });
    expect(link.getAttribute("href")).toBe("http://127.0.0.1:5180/invite/Zq81x0pLk2");
    expect(screen.getByText("sweep-report.pdf")).toBeVisible();
    expect(screen.getByText("(application/pdf, 20.0 kB)")).toBeVisible();
  });

  it("shows the text part and never renders the captured HTML", () => {
    const { container } = render(<OutboxMessageView message={message} />);
    expect(container.querySelector("script")).toBeNull();
    expect(container.textContent).not.toContain("window.__ran");
  });
});
