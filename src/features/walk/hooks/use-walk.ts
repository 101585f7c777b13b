import { useCallback, useEffect, useRef, useState } from "react";
import type { SamplePoint } from "#core/contracts/sweeps";
import { pullSweep } from "../api/remote-sweep";
import type { LocalReading, LocalSweep, ReadingValues } from "../model/local-types";
import {
  addReading,
  commitDrafts,
  getLocalSweep,
  keepDraftValues,
  removeReading,
  saveSweep,
  sweepReadings,
  updateReading,
} from "../model/reading-store";
import { walkDb } from "../model/walk-db";
import { afterSubmitAsked } from "../model/sweep-sync";
import { passIdAt, passIdForNewReading } from "../model/pinpoint-pass";
import { refreshCounts, subscribeSync, syncSoon } from "./sync-loop";

/** Values a new reading starts with instead of the defaults. */
type ReadingPreset = Partial<Pick<ReadingValues, "samplePoint" | "note">>;

export interface WalkState {
  sweep: LocalSweep | null;
  readings: LocalReading[];
  loading: boolean;
  error: string | null;
}

/** Remembered between readings: the sample point of the previous one. */
function lastSamplePoint(readings: readonly LocalReading[]): SamplePoint {
  return readings.length ? readings[readings.length - 1].samplePoint : "grille";
}

/**
 * The Walk screen's state: the sweep and its readings as the device holds them. Every action
 * writes IndexedDB first and only then updates the screen and nudges the sync queue.
 */
export function useWalk(sweepId: string) {
  const [state, setState] = useState<WalkState>({ sweep: null, readings: [], loading: true, error: null });
  const readingsRef = useRef<LocalReading[]>([]);
  readingsRef.current = state.readings;
  // A new reading belongs to the pinpoint pass open now, if any.
  const sweepRef = useRef<LocalSweep | null>(null);
  sweepRef.current = state.sweep;

  const reload = useCallback(async () => {
    const db = await walkDb();
    const readings = await sweepReadings(db, sweepId);
    const sweep = (await getLocalSweep(db, sweepId)) ?? null;
    setState((s) => ({ ...s, sweep, readings }));
  }, [sweepId]);

  useEffect(() => {
    let cancelled = false;
    void (async () => {
      try {
        const db = await walkDb();
        let sweep = await getLocalSweep(db, sweepId);
        if (!sweep) sweep = await pullSweep(db, sweepId);
        const readings = await sweepReadings(db, sweepId);
        if (!cancelled) setState({ sweep, readings, loading: false, error: null });
      } catch (e) {
        if (!cancelled)
          setState({ sweep: null, readings: [], loading: false, error: e instanceof Error ? e.message : String(e) });
      }
    })();
    return () => {
      cancelled = true;
    };
  }, [sweepId]);

  const changed = useCallback(() => {
    void refreshCounts();
    syncSoon();
  }, []);

  // After a pass that changed something (uploaded or refused readings), read the sweep again so
  // the marks of refused readings and the list's states follow.
  useEffect(() => {
    let last: unknown = null;
    return subscribeSync((s) => {
      if (s.lastReport && s.lastReport !== last) {
        last = s.lastReport;
        if (s.lastReport.confirmed + s.lastReport.rejected + s.lastReport.submitted > 0) void reload();
      }
    });
  }, [reload]);

  /**
   * A tap on the plan: the reading exists (on the device) from this moment, as a keypad draft. A
   * preset sample point and note (the supply-air check the live guide asks for) replace the defaults.
   */
  const tap = useCallback(
    async (x: number, y: number, at: number, preset: ReadingPreset = {}) => {
      const db = await walkDb();
      const values: ReadingValues = {
        x,
        y,
        takenAt: new Date(at).toISOString(),
        ppm: 0,
        atLeast: false,
        samplePoint: lastSamplePoint(readingsRef.current),
        note: "",
        ...preset,
      };
      const r = await addReading(db, sweepId, values, { draft: true, passId: passIdForNewReading(sweepRef.current) });
      setState((s) => ({ ...s, readings: [...s.readings, r] }));
      return r;
    },
    [sweepId],
  );

  /**
   * The next tap while the keypad is open: save the reading on it, then drop the new one, and
   * draw both in ONE render (a tap must show at once, even in a sweep of thousands).
   */
  const saveAndTap = useCallback(
    async (
      id: string,
      values: Partial<ReadingValues>,
      x: number,
      y: number,
      at: number,
      preset: ReadingPreset = {},
    ) => {
      const db = await walkDb();
      const saved = await updateReading(db, id, values, { commit: true });
      const samplePoint = saved?.samplePoint ?? lastSamplePoint(readingsRef.current);
      const r = await addReading(
        db,
        sweepId,
        { x, y, takenAt: new Date(at).toISOString(), ppm: 0, atLeast: false, samplePoint, note: "", ...preset },
        { draft: true, passId: passIdForNewReading(sweepRef.current) },
      );
      setState((s) => ({ ...s, readings: [...s.readings.map((x) => (x.id === id && saved ? saved : x)), r] }));
      changed();
      return r;
    },
    [sweepId, changed],
  );

  const save = useCallback(
    async (id: string, values: Partial<ReadingValues>) => {
      const db = await walkDb();
      const r = await updateReading(db, id, values, { commit: true });
      if (r) setState((s) => ({ ...s, readings: s.readings.map((x) => (x.id === id ? r : x)) }));
      changed();
      return r;
    },
    [changed],
  );

  /** What the keypad shows on the open reading: on the device only, never uploaded while open. */
  const keepDraft = useCallback(async (id: string, values: Partial<ReadingValues>) => {
    const db = await walkDb();
    const r = await keepDraftValues(db, id, values);
    if (r) setState((s) => ({ ...s, readings: s.readings.map((x) => (x.id === id ? r : x)) }));
    return r;
  }, []);

  /**
   * Moves a reading on the plan. The open one just moves (it is not uploaded yet); a committed one
   * changes as an edit, which the server keeps in the audit trail and which marks its analysis stale.
   */
  const move = useCallback(
    async (id: string, x: number, y: number) => {
      const db = await walkDb();
      const now = await db.get("readings", id);
      if (!now) return undefined;
      return now.sync.kind === "draft" ? keepDraft(id, { x, y }) : save(id, { x, y });
    },
    [keepDraft, save],
  );

  const remove = useCallback(
    async (id: string) => {
      const db = await walkDb();
      await removeReading(db, id);
      setState((s) => ({ ...s, readings: s.readings.filter((x) => x.id !== id) }));
      changed();
    },
    [changed],
  );

  const addMany = useCallback(
    async (list: ReadingValues[]) => {
      const db = await walkDb();
      for (const v of list) await addReading(db, sweepId, v, { passId: passIdAt(sweepRef.current, v.takenAt) });
      await reload();
      changed();
    },
    [sweepId, reload, changed],
  );

  const submit = useCallback(async () => {
    const db = await walkDb();
    const s = await getLocalSweep(db, sweepId);
    if (!s) return;
    // The reading still on the keypad is part of the sweep: it is committed with the submit.
    await commitDrafts(db, sweepId);
    await saveSweep(db, { ...s, sync: afterSubmitAsked(s.sync) });
    await reload();
    changed();
  }, [sweepId, reload, changed]);

  return { ...state, tap, saveAndTap, save, keepDraft, move, remove, addMany, submit, reload };
}
