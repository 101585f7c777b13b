import type { LocalPass, LocalSweep } from "./local-types";

/**
 * Pinpoint passes (pure): part of a sweep walked again with fans stopped or in a defrost, so the gas
 * settles where it leaks. The pass open on the device takes every new reading; ending it returns the
 * readings to the sweep's own conditions.
 */

/**
 * Minutes after which the screen asks for the fans to be restored. Stopped fans and a defrost warm the
 * product; 20 min is about how long a case is left in a defrost (common practice, no published source).
 * The technician may change it per pass.
 */
export const DEFAULT_RESTORE_AFTER_MIN = 20;
export const RESTORE_AFTER_MIN_RANGE = { min: 5, max: 60 } as const;

export type PassCondition = "fans-stopped" | "defrost";

export interface PassStart {
  condition: PassCondition;
  fixtureId: string | null;
  restoreAfterMin?: number;
}

/** The pass open now (started, not ended), if any. */
export function openPass(sweep: Pick<LocalSweep, "passes">): LocalPass | null {
  return sweep.passes.find((p) => p.endedAt === null) ?? null;
}

/** The pass a new reading belongs to: the open one, else the first pass (null). */
export function passIdForNewReading(sweep: Pick<LocalSweep, "passes"> | null): string | null {
  return sweep ? (openPass(sweep)?.id ?? null) : null;
}

/** The pass whose time span holds this time (readings read from a detector's log afterwards), else the first. */
export function passIdAt(sweep: Pick<LocalSweep, "passes"> | null, atIso: string): string | null {
  const t = Date.parse(atIso);
  const p = sweep?.passes.find(
    (p) => Date.parse(p.startedAt) <= t && (p.endedAt === null || t < Date.parse(p.endedAt)),
  );
  return p?.id ?? null;
}

export function clampRestoreMinutes(min: number): number {
  if (!Number.isFinite(min)) return DEFAULT_RESTORE_AFTER_MIN;
  return Math.min(RESTORE_AFTER_MIN_RANGE.max, Math.max(RESTORE_AFTER_MIN_RANGE.min, Math.round(min)));
}

/** Starts a pass (ending one still open first: one pass at a time). */
export function startPass(sweep: LocalSweep, start: PassStart, id: string, atIso: string): LocalSweep {
  const ended = sweep.passes.map((p) => (p.endedAt === null ? endOne(p, atIso) : p));
  const pass: LocalPass = {
    id,
    fans: "stopped",
    defrost: start.condition === "defrost",
    fixtureId: start.fixtureId,
    startedAt: atIso,
    endedAt: null,
    restoreAfterMin: clampRestoreMinutes(start.restoreAfterMin ?? DEFAULT_RESTORE_AFTER_MIN),
    sync: { kind: "queued" },
  };
  return { ...sweep, passes: [...ended, pass] };
}

function endOne(p: LocalPass, atIso: string): LocalPass {
  // never before its start, even with a clock set back meanwhile
  const at = Date.parse(atIso) < Date.parse(p.startedAt) ? p.startedAt : atIso;
  return { ...p, endedAt: at, sync: p.sync.kind === "refused" ? p.sync : { kind: "queued" } };
}

/** Ends the open pass: the fans are back on, new readings go to the first pass again. */
export function endPass(sweep: LocalSweep, atIso: string): LocalSweep {
  return { ...sweep, passes: sweep.passes.map((p) => (p.endedAt === null ? endOne(p, atIso) : p)) };
}

export function setRestoreMinutes(sweep: LocalSweep, passId: string, min: number): LocalSweep {
  return {
    ...sweep,
    passes: sweep.passes.map((p) => (p.id === passId ? { ...p, restoreAfterMin: clampRestoreMinutes(min) } : p)),
  };
}

/** The server has this version of the pass (unless it changed meanwhile on the device). */
export function passConfirmed(sweep: LocalSweep, sent: LocalPass): LocalSweep {
  return {
    ...sweep,
    passes: sweep.passes.map((p) =>
      p.id === sent.id && p.endedAt === sent.endedAt ? { ...p, sync: { kind: "on-server" } } : p,
    ),
  };
}

export function passRefused(sweep: LocalSweep, passId: string, reasons: Record<string, string>): LocalSweep {
  return {
    ...sweep,
    passes: sweep.passes.map((p) => (p.id === passId ? { ...p, sync: { kind: "refused", reasons } } : p)),
  };
}

/** The reminder to restore the fans: when it is due and how long is left (negative once overdue). */
export function restoreReminder(pass: LocalPass, nowMs: number): { dueAtMs: number; leftMs: number; overdue: boolean } {
  const dueAtMs = Date.parse(pass.startedAt) + pass.restoreAfterMin * 60_000;
  const leftMs = dueAtMs - nowMs;
  return { dueAtMs, leftMs, overdue: leftMs <= 0 };
}

/** "14:05" left, or "3:20" over. */
export function clockText(ms: number): string {
  const s = Math.floor(Math.abs(ms) / 1000);
  return `${Math.floor(s / 60)}:${String(s % 60).padStart(2, "0")}`;
}

/** The pass number (2, 3, …) of each pass id; the first pass is 1. */
export function passNumbers(sweep: Pick<LocalSweep, "passes">): Map<string, number> {
  return new Map(sweep.passes.map((p, i) => [p.id, i + 2]));
}

/** The words for a pass's air: "fans stopped" or "in defrost", over a fixture or the whole store. */
export function passConditionText(pass: Pick<LocalPass, "fans" | "defrost">): string {
  return pass.defrost ? "in defrost" : pass.fans === "stopped" ? "fans stopped" : "fans running";
}
