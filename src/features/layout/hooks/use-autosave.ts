import { useCallback, useEffect, useRef, useState } from "react";
import type { FieldError } from "#core/contracts/fixtures";
import { isApiRequestError } from "../../../lib/api-client";
import { useSaveFixtures } from "../api/save-fixtures";
import { sceneErrors, sceneFixtures, type Scene } from "../model/scene";

export type SaveState =
  | { status: "saved" }
  | { status: "unsaved" }
  | { status: "saving" }
  | { status: "invalid"; errors: FieldError[] }
  | { status: "conflict"; message: string }
  | { status: "failed"; message: string };

/** A wait after the last edit before saving, so a burst of nudges is one request. */
export const AUTOSAVE_DELAY_MS = 800;

function sameContent(a: Scene | null, b: Scene): boolean {
  return a !== null && a.fixtures === b.fixtures && a.order === b.order;
}

/**
 * Saves the scene's fixtures a moment after each edit, with the revision the editor started
 * from; the server refuses a stale revision (409), which stops autosave until the lead tech
 * reloads: nothing is ever overwritten silently. Selection changes are not edits.
 */
export function useAutosave(planId: string, scene: Scene, initialRevision: number, enabled: boolean) {
  const save = useSaveFixtures();
  // mutate is stable; the result object around it is new on every render.
  const mutate = useRef(save.mutate);
  mutate.current = save.mutate;
  const revision = useRef(initialRevision);
  const saved = useRef<Scene | null>(scene);
  const inFlight = useRef(false);
  const [state, setState] = useState<SaveState>({ status: "saved" });
  const latest = useRef(scene);
  latest.current = scene;

  const run = useCallback(() => {
    const target = latest.current;
    if (inFlight.current || sameContent(saved.current, target)) return;
    const errors = sceneErrors(target);
    if (errors.length > 0) {
      setState({ status: "invalid", errors });
      return;
    }
    inFlight.current = true;
    setState({ status: "saving" });
    mutate.current(
      { planId, layoutRevision: revision.current, fixtures: sceneFixtures(target) },
      {
        onSuccess: (r) => {
          revision.current = r.layoutRevision;
          saved.current = target;
          inFlight.current = false;
          // Edits made during the request are saved next.
          if (sameContent(target, latest.current)) setState({ status: "saved" });
          else {
            setState({ status: "unsaved" });
            window.setTimeout(run, AUTOSAVE_DELAY_MS);
          }
        },
        onError: (e) => {
          inFlight.current = false;
          if (isApiRequestError(e) && e.status === 409) setState({ status: "conflict", message: e.message });
          else if (isApiRequestError(e) && e.code === "validation_failed") {
            setState({
              status: "invalid",
              errors: Object.entries(e.fields).map(([path, message]) => ({ path, message })),
            });
          } else
            setState({
              status: "failed",
              message: isApiRequestError(e) ? e.message : "The layout could not be saved.",
            });
        },
      },
    );
  }, [planId]);

  const blocked = state.status === "conflict";
  useEffect(() => {
    if (!enabled || blocked || sameContent(saved.current, scene)) return;
    setState((s) => (s.status === "saving" ? s : { status: "unsaved" }));
    const t = window.setTimeout(run, AUTOSAVE_DELAY_MS);
    return () => window.clearTimeout(t);
  }, [scene.fixtures, scene.order, enabled, blocked, run]);

  // Leaving with edits not yet saved asks first (the browser shows its own wording).
  useEffect(() => {
    const warn = (e: BeforeUnloadEvent) => {
      if (!sameContent(saved.current, latest.current)) e.preventDefault();
    };
    window.addEventListener("beforeunload", warn);
    return () => window.removeEventListener("beforeunload", warn);
  }, []);

  /** After "reload theirs": the loaded scene and revision become the saved baseline. */
  const rebase = useCallback((loaded: Scene, layoutRevision: number) => {
    revision.current = layoutRevision;
    saved.current = loaded;
    setState({ status: "saved" });
  }, []);

  return { state, saveNow: run, rebase };
}
