import { useEffect, useRef, useState } from "react";
import type { KeypadValue } from "../components/ppm-keypad";
import type { useWalk } from "./use-walk";

const valuesOf = (v: KeypadValue | null) =>
  v ? { ppm: v.ppm, atLeast: v.atLeast, samplePoint: v.samplePoint, note: v.note } : {};

/**
 * The reading on the keypad (the "open" one): which it is, what its keypad shows, and how it is
 * committed (see DEVELOPERS.md, "The open reading is a reading"). Also the screen's one queue of
 * actions: taps can come faster than IndexedDB answers, so actions run one after another and read
 * the latest open reading and readings from refs rather than from a render that may be behind.
 */
export function useOpenReading(walk: ReturnType<typeof useWalk>) {
  const [draftId, setDraftIdState] = useState<string | null>(null);
  const draftRef = useRef<string | null>(null);
  const setDraftId = (id: string | null) => {
    draftRef.current = id;
    setDraftIdState(id);
  };
  const chain = useRef<Promise<unknown>>(Promise.resolve());
  const serial =
    <A extends unknown[]>(fn: (...args: A) => Promise<void>) =>
    (...args: A) => {
      chain.current = chain.current.then(() => fn(...args)).catch((e) => console.error(e));
    };
  const readingsRef = useRef(walk.readings);
  readingsRef.current = walk.readings;
  const typed = useRef<KeypadValue | null>(null);
  // A tap whose keypad was open when the tab closed or crashed comes back on the keypad.
  const restored = useRef(false);
  useEffect(() => {
    if (walk.loading || restored.current) return;
    restored.current = true;
    const leftover = walk.readings.findLast((r) => r.sync.kind === "draft");
    if (leftover) setDraftId(leftover.id);
  }, [walk.loading, walk.readings]);

  // Leaving the screen (Leave, the browser's back, another route) commits the open reading with
  // what its keypad shows. A reload or a crash does not run this: the reading then stays open
  // and comes back on the keypad.
  useEffect(
    () => () => {
      const id = draftRef.current;
      if (!id) return;
      void walk.save(id, valuesOf(typed.current));
    },
    // on unmount only (save is stable)
    [],
  );

  /** Commits the open reading with what its keypad shows. */
  const commitOpen = async () => {
    const id = draftRef.current;
    if (!id) return;
    const v = typed.current;
    typed.current = null;
    setDraftId(null);
    await walk.save(id, valuesOf(v));
  };

  const undo = serial(async () => {
    const id = draftRef.current;
    if (id) {
      setDraftId(null);
      await walk.remove(id);
      return;
    }
    const done = readingsRef.current.filter((r) => r.sync.kind !== "draft");
    const last = done[done.length - 1];
    if (last) await walk.remove(last.id);
  });

  // Typed values of the open reading go to the device as they are typed (one small write each),
  // so a reload brings them back; they are not uploaded until the reading is committed.
  const keepTyped = (id: string, v: KeypadValue) => {
    typed.current = v;
    const r = readingsRef.current.find((x) => x.id === id);
    if (
      !r ||
      r.sync.kind !== "draft" ||
      (r.ppm === v.ppm && r.atLeast === v.atLeast && r.samplePoint === v.samplePoint && r.note === v.note)
    )
      return;
    serial(async () => {
      await walk.keepDraft(id, v);
    })();
  };

  return { draftId, draftRef, setDraftId, typed, readingsRef, serial, commitOpen, keepTyped, undo };
}
