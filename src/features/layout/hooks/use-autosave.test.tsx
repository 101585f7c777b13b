import { QueryClient, QueryClientProvider } from "@tanstack/react-query";
import { renderHook, waitFor } from "@testing-library/react";
import type { ReactNode } from "react";
import { beforeEach, describe, expect, it } from "vitest";
import { apiError, stubFetch } from "../../../../tests/helpers/stub-fetch";
import { setCsrfToken } from "../../../lib/api-client";
import { applyAction, move } from "../model/actions";
import { createScene, type Scene } from "../model/scene";
import { openCase, rect, uuid } from "../model/test-builders";
import { useAutosave } from "./use-autosave";

const PLAN = "7a1b2c3d-4e5f-4a6b-8c7d-9e0f1a2b3c4d";
const base = createScene({ width: 40, height: 20 }, [openCase(1, rect(2, 2, 3.75, 1.1), "Dairy 1")]);

function wrapper({ children }: { children: ReactNode }) {
  const client = new QueryClient({ defaultOptions: { mutations: { retry: false } } });
  return <QueryClientProvider client={client}>{children}</QueryClientProvider>;
}

beforeEach(() => setCsrfToken("csrf-lead"));

describe("autosave", () => {
  it("saves an edit with the revision it started from and takes the new revision for the next", async () => {
    let revision = 4;
    const calls = stubFetch({
      [`PUT /api/plans/${PLAN}/fixtures`]: (req) => {
        const body = req.body as { layoutRevision: number; fixtures: unknown[] };
        if (body.layoutRevision !== revision) return apiError(409, "conflict", "stale");
        revision += 1;
        return {
          body: { planId: PLAN, layoutRevision: revision, bounds: { width: 40, height: 20 }, fixtures: body.fixtures },
        };
      },
    });
    const { result, rerender } = renderHook(({ scene }: { scene: Scene }) => useAutosave(PLAN, scene, 4, true), {
      wrapper,
      initialProps: { scene: base },
    });
    expect(result.current.state.status).toBe("saved");
    const moved = applyAction(base, move([uuid(1)], 1, 0));
    rerender({ scene: moved });
    expect(result.current.state.status).toBe("unsaved");
    await waitFor(() => expect(result.current.state.status).toBe("saved"), { timeout: 10_000 });
    rerender({ scene: applyAction(moved, move([uuid(1)], 1, 0)) });
    await waitFor(() => expect(calls.filter((c) => c.method === "PUT")).toHaveLength(2), { timeout: 10_000 });
    await waitFor(() => expect(result.current.state.status).toBe("saved"));
    expect(
      calls.filter((c) => c.method === "PUT").map((c) => (c.body as { layoutRevision: number }).layoutRevision),
    ).toEqual([4, 5]);
  });

  it("stops on a conflict and never overwrites; a rebase on the reloaded layout starts again", async () => {
    const calls = stubFetch({
      [`PUT /api/plans/${PLAN}/fixtures`]: apiError(
        409,
        "conflict",
        "The layout was changed by someone else since you opened it.",
      ),
    });
    const { result, rerender } = renderHook(({ scene }: { scene: Scene }) => useAutosave(PLAN, scene, 4, true), {
      wrapper,
      initialProps: { scene: base },
    });
    const mine = applyAction(base, move([uuid(1)], 1, 0));
    rerender({ scene: mine });
    await waitFor(() => expect(result.current.state.status).toBe("conflict"), { timeout: 10_000 });
    // More edits after the conflict send nothing.
    rerender({ scene: applyAction(mine, move([uuid(1)], 0, 1)) });
    await new Promise((r) => setTimeout(r, 1200));
    expect(calls.filter((c) => c.method === "PUT")).toHaveLength(1);
    // "Reload theirs": their layout becomes the saved baseline.
    const theirs = createScene({ width: 40, height: 20 }, []);
    result.current.rebase(theirs, 9);
    rerender({ scene: theirs });
    await waitFor(() => expect(result.current.state.status).toBe("saved"));
  });

  it("does not send a layout that the shared validation refuses, and says why", async () => {
    const calls = stubFetch({});
    const { result, rerender } = renderHook(({ scene }: { scene: Scene }) => useAutosave(PLAN, scene, 4, true), {
      wrapper,
      initialProps: { scene: base },
    });
    // A case pushed past the plan's right edge (40 m): the server would refuse it too.
    const outside = { ...base, fixtures: { [uuid(1)]: openCase(1, rect(38, 2, 3.75, 1.1)) } };
    rerender({ scene: outside });
    await waitFor(() => expect(result.current.state.status).toBe("invalid"), { timeout: 10_000 });
    const state = result.current.state as { status: "invalid"; errors: { path: string }[] };
    expect(state.errors.map((e) => e.path)).toContain("fixtures.0.polygon.1");
    expect(calls).toHaveLength(0);
  });
});
