/**
 * What the Walk screen is doing, as one union: what the next tap on the plan means, whether the
 * keypad shows an earlier reading, and whether the leak form is open. Pure (no React), so every
 * path is tested without a screen; walk-screen.tsx only sends events and carries out the effect.
 */

/** Where a leak was tapped, and the fixture under it. */
export interface LeakSpot {
  x: number;
  y: number;
  fixtureId: string | null;
}

export type WalkMode<R extends { id: string }> =
  /** A tap takes a reading (the keypad opens on it). */
  | { kind: "walking" }
  /** The keypad shows an earlier reading; a tap closes it and takes a new one. */
  | { kind: "editing"; reading: R }
  /** The next tap moves this reading there; `editing` is the keypad to return to. */
  | { kind: "moving"; readingId: string; editing: R | null }
  /** The next tap marks where the leak is. */
  | { kind: "placing-leak" }
  /** The leak form is open over the plan: taps wait until it closes. */
  | { kind: "describing-leak"; spot: LeakSpot };

export type WalkEvent<R extends { id: string }> =
  | { type: "tap"; x: number; y: number; fixtureId: string | null }
  | { type: "edit"; reading: R }
  | { type: "move"; readingId: string }
  /** The move was stored: the keypad shows the moved reading if it was open on it. */
  | { type: "moved"; reading: R }
  | { type: "toggle-leak" }
  /** Cancel a move (back to the keypad it came from), close the keypad or the leak form. */
  | { type: "cancel" }
  /** The edit keypad saved, or the leak form saved. */
  | { type: "done" };

/** What the screen must do for a tap; every other event only changes the mode. */
export type TapEffect = { kind: "none" } | { kind: "take-reading" } | { kind: "move-reading"; readingId: string };

const WALKING = { kind: "walking" } as const;
const NONE: TapEffect = { kind: "none" };

export function walkStep<R extends { id: string }>(
  mode: WalkMode<R>,
  event: WalkEvent<R>,
  readOnly: boolean,
): { mode: WalkMode<R>; effect: TapEffect } {
  const to = (next: WalkMode<R>) => ({ mode: next, effect: NONE });
  switch (event.type) {
    case "tap":
      if (readOnly) return to(mode);
      switch (mode.kind) {
        case "moving":
          return {
            mode: mode.editing ? { kind: "editing", reading: mode.editing } : WALKING,
            effect: { kind: "move-reading", readingId: mode.readingId },
          };
        case "placing-leak":
          return to({ kind: "describing-leak", spot: { x: event.x, y: event.y, fixtureId: event.fixtureId } });
        case "describing-leak":
          return to(mode);
        default:
          return { mode: WALKING, effect: { kind: "take-reading" } };
      }
    case "edit":
      return to(mode.kind === "describing-leak" ? mode : { kind: "editing", reading: event.reading });
    case "move":
      return to({
        kind: "moving",
        readingId: event.readingId,
        editing: mode.kind === "editing" && mode.reading.id === event.readingId ? mode.reading : null,
      });
    case "moved":
      return to(
        mode.kind === "editing" && mode.reading.id === event.reading.id ? { ...mode, reading: event.reading } : mode,
      );
    case "toggle-leak":
      if (mode.kind === "describing-leak") return to(mode);
      return to(mode.kind === "placing-leak" ? WALKING : { kind: "placing-leak" });
    case "cancel":
      return to(mode.kind === "moving" && mode.editing ? { kind: "editing", reading: mode.editing } : WALKING);
    case "done":
      return to(WALKING);
  }
}

/** The reading the edit keypad shows, if any (it stays open while the reading is being moved). */
export function editedReading<R extends { id: string }>(mode: WalkMode<R>): R | null {
  return mode.kind === "editing" ? mode.reading : mode.kind === "moving" ? mode.editing : null;
}
