// Konva needs a 2D context; jsdom has none. The mock lets components mount, while real
// drawing is checked in Chromium by the browser suite.
import "vitest-canvas-mock";
// DOM matchers (toBeVisible, toHaveTextContent, …) so tests assert what a person would see.
import "@testing-library/jest-dom/vitest";
import { cleanup } from "@testing-library/react";
import { afterEach, vi } from "vitest";

// Vitest runs without globals here, so Testing Library cannot register its own cleanup.
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
  localStorage.clear();
  document.documentElement.className = "";
});
