import { render, screen } from "@testing-library/react";
import { describe, expect, it, vi } from "vitest";
import { createMemoryRouter, RouterProvider } from "react-router";
import { RootErrorPage } from "./error-page";

function Broken(): never {
  throw new Error('relation "memberships" does not exist at Parser.parse (/srv/app/node_modules/pg/lib/parser.js:12)');
}

describe("error page", () => {
  it("explains in words and shows no error text or stack", async () => {
    const consoleError = vi.spyOn(console, "error").mockImplementation(() => {});
    const router = createMemoryRouter([{ path: "/", Component: Broken, ErrorBoundary: RootErrorPage }]);
    const { container } = render(<RouterProvider router={router} />);
    expect(await screen.findByRole("heading", { name: "Something went wrong" })).toBeVisible();
    expect(container.textContent).not.toMatch(/memberships|parser\.js|node_modules/);
    expect(screen.getByRole("button", { name: "Reload the page" })).toBeVisible();
    consoleError.mockRestore();
  });
});
