import { onlineManager } from "@tanstack/react-query";
import { screen } from "@testing-library/react";
import { afterEach, describe, expect, it, vi } from "vitest";
import { renderApp } from "../../../../tests/helpers/render-client";
import { sessionFor } from "../../../../tests/helpers/session-fixtures";
import { rememberSession } from "./offline-session";

// The Walk screen sits behind the session: offline, it must open from the session kept on the device.
describe("the session without a connection", () => {
  afterEach(() => {
    // TanStack Query's online manager is one per page, shared with the next file (decision 0083).
    onlineManager.setOnline(true);
  });

  it("is read from the device when the browser has said it is offline, instead of waiting for a connection", async () => {
    rememberSession(sessionFor("technician"));
    vi.stubGlobal("fetch", () => Promise.reject(new TypeError("Failed to fetch")));
    // The tab went offline (the browser's "offline" event) before this page needed the session.
    onlineManager.setOnline(false);
    renderApp("/help");
    expect(await screen.findByText("Northfield Cold Care")).toBeVisible();
  });
});
