import { useEffect, useMemo, useRef, useState } from "react";
import type { Fixture } from "#core/contracts/fixtures";
import { toLocatorPlan, type LocatorPlan } from "#core/domain/layout/to-locator-input";
import type { LocalReading, LocalSweep } from "../model/local-types";
import type { LiveReply } from "../model/live-messages";
import { liveRequest } from "../model/live-request";
import { LIVE_START, liveReplied, liveRequested, type LiveState } from "../model/live-state";

/** Wait this long after the last committed reading before asking again: a burst of saves asks once (ms). */
const DEBOUNCE_MS = 250;

/**
 * Live suspects and next probes for the readings on the device: after each committed reading
 * (debounced) the readings go to a Web Worker that runs the locator (model/live-worker-body.ts), and
 * its answers come back here. Nothing goes to the network. Without Worker support (or a plan without
 * a size) it stays idle, so the Walk screen works as before.
 */
export function useLiveGuide(args: {
  sweep: LocalSweep | null;
  plan: { widthM: number | null; heightM: number | null } | null;
  fixtures: readonly Fixture[];
  readings: readonly LocalReading[];
}): LiveState {
  const { sweep, plan, fixtures, readings } = args;
  const [state, setState] = useState<LiveState>(LIVE_START);
  const worker = useRef<Worker | null>(null);
  const nextId = useRef(0);

  const fansRunning = sweep?.fans !== "stopped";
  const locatorPlan = useMemo<LocatorPlan | null>(() => {
    if (!plan?.widthM || !plan.heightM) return null;
    try {
      return toLocatorPlan({ width: plan.widthM, height: plan.heightM }, fixtures, { fansRunning });
    } catch {
      return null; // a plan the locator cannot read: no live estimate, the sweep goes on
    }
  }, [plan?.widthM, plan?.heightM, fixtures, fansRunning]);

  useEffect(() => {
    if (typeof Worker === "undefined") return;
    const w = new Worker(new URL("../worker/live-guide.worker.ts", import.meta.url), { type: "module" });
    w.onmessage = (e: MessageEvent<LiveReply>) => {
      setState((s) => liveReplied(s, e.data));
      // Tells whoever listens (bench:live times the updates with it) what the worker answered and when.
      const { id, kind } = e.data;
      const ms = "ms" in e.data ? e.data.ms : null;
      window.dispatchEvent(
        new CustomEvent("plumeline:live-reply", { detail: { id, kind, ms, at: performance.now() } }),
      );
    };
    w.onerror = (e) => {
      e.preventDefault();
      setState((s) => ({ ...s, problems: ["The live estimate stopped on this device."] }));
    };
    worker.current = w;
    return () => {
      w.terminate();
      worker.current = null;
    };
  }, []);

  useEffect(() => {
    const w = worker.current;
    if (!w || !sweep || !locatorPlan) return;
    const timer = setTimeout(() => {
      const id = nextId.current++;
      const request = liveRequest(id, sweep, locatorPlan, readings);
      setState((s) => liveRequested(s, id));
      w.postMessage(request);
      window.dispatchEvent(
        new CustomEvent("plumeline:live-request", { detail: { id, readings: readings.length, at: performance.now() } }),
      );
    }, DEBOUNCE_MS);
    return () => clearTimeout(timer);
  }, [readings, locatorPlan, sweep?.id, sweep?.transportDelayS, sweep?.timeConstantS, sweep?.alarmPpm]);

  return state;
}
