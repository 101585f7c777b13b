import { fireEvent, screen, waitFor, within } from "@testing-library/react";
import { beforeEach, describe, expect, it } from "vitest";
import type { ReportSend } from "#core/contracts/reports";
import type { MailDelivery } from "#core/contracts/mail-delivery";
import { renderOnRoute } from "../../../../tests/helpers/render-client";
import { stubFetch } from "../../../../tests/helpers/stub-fetch";
import { setCsrfToken } from "../../../lib/api-client";
import { ReportPanel } from "./report-panel";

const SWEEP = "5b1c2d3e-4f5a-4b6c-8d7e-9f0a1b2c3d4e";
const SEND = "7c6b5a49-3827-4615-9e0d-1c2b3a4f5e6d";

function send(delivery: Partial<MailDelivery>, bytes: number | null = null): ReportSend {
  return {
    id: SEND,
    sweepId: SWEEP,
    sentBy: "Mara Quist",
    recipients: ["area.manager@example.org"],
    subject: "Sweep report: Thistle Lane Grocers, 2 Dec 2026, 07:10",
    filename: "sweep-thistle-lane-grocers-2026-12-02.pdf",
    bytes,
    sentAt: "2026-12-02T09:00:00.000Z",
    delivery: {
      mailId: "0e1d2c3b-4a59-4687-9f6e-5d4c3b2a1908",
      state: "preparing",
      attempts: 0,
      error: null,
      sentAt: null,
      ...delivery,
    },
  };
}

beforeEach(() => setCsrfToken("csrf-engineer"));

describe("report panel", () => {
  it("says the PDF is being made after Send, then announces in the live list that it could not be made, with Send again", async () => {
    let sends: ReportSend[] = [];
    stubFetch({
      "GET /api/sweeps/5b1c2d3e-4f5a-4b6c-8d7e-9f0a1b2c3d4e/report/recipients": { body: { storeContacts: [] } },
      "GET /api/sweeps/5b1c2d3e-4f5a-4b6c-8d7e-9f0a1b2c3d4e/report/sends": () => ({ body: { sends } }),
      "POST /api/sweeps/5b1c2d3e-4f5a-4b6c-8d7e-9f0a1b2c3d4e/report/send": () => {
        sends = [send({ state: "preparing" })];
        return { status: 201, body: sends[0] };
      },
    });
    renderOnRoute(<ReportPanel sweepId={SWEEP} canSend zoned={(iso) => iso.slice(0, 16)} />, { path: "/map" });
    fireEvent.change(screen.getByLabelText("Other addresses"), { target: { value: "area.manager@example.org" } });
    fireEvent.click(screen.getByRole("button", { name: "Send the report" }));

    expect(await screen.findByText(/Sending to area\.manager@example\.org: the PDF is being made/)).toBeVisible();
    const list = await screen.findByTestId("report-sends");
    expect(list).toHaveAttribute("aria-live", "polite");
    expect(await within(list).findByText("Making the PDF: the e-mail goes out once it is ready.")).toBeVisible();

    // The job gave up: the list is polled while a send is preparing, and shows why, with Send again.
    sends = [
      send({ state: "failed", attempts: 0, error: "The PDF report could not be made: the drawing ran out of memory" }),
    ];
    await waitFor(
      () =>
        expect(
          within(list).getByText("Not sent: The PDF report could not be made: the drawing ran out of memory"),
        ).toBeVisible(),
      { timeout: 10_000 },
    );
    expect(within(list).getByRole("button", { name: "Send again" })).toBeVisible();
  }, 20_000);
});
