// Konva needs a 2D context; jsdom has none. The mock lets components mount, while real
// drawing is checked in Chromium by the browser suite.
import "vitest-canvas-mock";
// DOM matchers (toBeVisible, toHaveTextContent, …) so tests assert what a person would see.
import "@testing-library/jest-dom/vitest";
import { cleanup, configure } from "@testing-library/react";
import { afterEach, beforeAll, vi } from "vitest";

// A lazy route's first import and jsdom's start-up take seconds on a loaded 2-core machine: findBy*
// waits up to 15 s (the library's default is 1 s) rather than failing on a slow machine. At a load
// of 50 the app's first route took more than 5 s twice in a row ("Opening Plumeline…"); a wait
// is a bound for a hang, never a claim about speed (decision 0119).
configure({ asyncUtilTimeout: 15_000 });

// Vitest runs without globals here, so Testing Library cannot register its own cleanup.
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
  localStorage.clear();
  document.documentElement.className = "";
});

// One jsdom serves many files in turn (tests/helpers/fresh-modules.ts): each file starts
// from an empty page and storage, at the same address, as it would in a jsdom of its own.
beforeAll(() => {
  document.body.innerHTML = "";
  document.title = "";
  localStorage.clear();
  sessionStorage.clear();
  window.history.replaceState(null, "", "/");
});
