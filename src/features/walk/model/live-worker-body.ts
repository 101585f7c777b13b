import { liveFit, liveProbes } from "#core/analysis/guide/live-guide";
import { LocatorInputError, parseLocatorInput } from "#core/contracts/locator-input";
import { sweepLocatorInput } from "#core/domain/fieldmap/sweep-locator-input";
import { liveRequestSchema, type LiveReply, type LiveRequest } from "./live-messages";

export interface LiveWorkerHost {
  post(reply: LiveReply): void;
  /** Runs `step` after the messages already waiting (a macrotask in the worker). */
  later(step: () => void): void;
  now(): number;
}

/**
 * The live-guide worker's message handling, as a pure object the tests drive: the worker file only
 * wires `receive` to `onmessage`. Only the newest request is worked on: requests that arrive while
 * one waits replace it, and a newer request skips the older one's next-probe step. Nothing a message
 * holds can throw out of here: a bad message or a plan the locator refuses is answered as "failed".
 */
export function liveWorkerBody(host: LiveWorkerHost) {
  let waiting: LiveRequest | null = null;
  let scheduled = false;

  function schedule() {
    if (scheduled) return;
    scheduled = true;
    host.later(run);
  }

  function run() {
    scheduled = false;
    const req = waiting;
    waiting = null;
    if (!req) return;
    if (req.readings.length === 0) {
      host.post({ id: req.id, kind: "estimate", estimate: { kind: "no-alarm", readings: 0 }, ms: 0 });
      host.post({ id: req.id, kind: "probes", probes: [], ms: 0 });
      return;
    }
    const started = host.now();
    let fit: ReturnType<typeof liveFit>;
    try {
      fit = liveFit(toInput(req));
    } catch (err) {
      host.post({ id: req.id, kind: "failed", problems: problemsOf(err) });
      return;
    }
    host.post({ id: req.id, kind: "estimate", estimate: fit.estimate, ms: host.now() - started });
    // With no suspect yet the probes trace the alarm's gas (evidence-search.ts); with no alarm there are none.
    if (fit.estimate.kind === "no-alarm") {
      host.post({ id: req.id, kind: "probes", probes: [], ms: 0 });
      return;
    }
    // The probes wait for any message already queued: a newer request makes these stale.
    host.later(() => {
      if (waiting && waiting.id > req.id) return;
      const probesStarted = host.now();
      try {
        const from = req.from ?? lastPlace(req);
        const probes = liveProbes(fit, from);
        host.post({ id: req.id, kind: "probes", probes, ms: host.now() - probesStarted });
      } catch (err) {
        host.post({ id: req.id, kind: "failed", problems: problemsOf(err) });
      }
    });
  }

  return {
    receive(data: unknown) {
      const parsed = liveRequestSchema.safeParse(data);
      if (!parsed.success) {
        const id = typeof (data as { id?: unknown })?.id === "number" ? (data as { id: number }).id : -1;
        host.post({
          id,
          kind: "failed",
          problems: parsed.error.issues.map((i) => `${i.path.join(".") || "message"}: ${i.message}`),
        });
        return;
      }
      if (waiting && waiting.id > parsed.data.id) return;
      waiting = parsed.data;
      schedule();
    },
  };
}

/** The request as the locator's input, built the way the server builds it for a stored sweep. */
function toInput(req: LiveRequest) {
  const rows = req.readings.map((r) => ({ ...r, takenAt: new Date(r.takenAt) }));
  const { input } = sweepLocatorInput(req.plan, new Date(req.startedAt), rows, req.instrument, req.passes ?? []);
  return parseLocatorInput(input);
}

function lastPlace(req: LiveRequest): { x: number; y: number } {
  const last = req.readings[req.readings.length - 1];
  return last ? { x: last.x, y: last.y } : { x: 0, y: 0 };
}

function problemsOf(err: unknown): string[] {
  if (err instanceof LocatorInputError) return err.problems;
  return [err instanceof Error ? err.message : String(err)];
}
