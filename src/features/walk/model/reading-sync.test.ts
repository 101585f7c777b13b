import { describe, expect, it } from "vitest";
import {
  afterEditConfirmed,
  afterRefused,
  afterRemove,
  afterUploadConfirmed,
  afterValuesChange,
  DRAFT,
  isDeleted,
  isOnServer,
  QUEUED_NEW,
  QUEUED_RANGE,
  syncFromLegacy,
  SYNCED,
  type ReadingSync,
} from "./reading-sync";
import {
  afterSubmitAsked,
  afterSweepCreated,
  afterSweepRefused,
  sweepStateText,
  sweepSyncFromLegacy,
} from "./sweep-sync";

// The steps of a reading's life between the device and the server (the offline-first queue of
// docs/decisions/0016 and DEVELOPERS.md "Sweeps and the Walk screen"). Pure: no IndexedDB here.
const T1 = "2026-11-02T14:00:00.000Z";
const T2 = "2026-11-02T14:05:00.000Z";
const refusedNew: ReadingSync = {
  kind: "refused",
  change: "new",
  reasons: { ppm: "must be 0 ppm or more" },
  editedAt: null,
};

describe("a reading's sync state", () => {
  it("walks a tap from the keypad to the server: draft, queued, synced", () => {
    expect(afterValuesChange(DRAFT, false, T1)).toEqual(DRAFT); // typing keeps it open
    const queued = afterValuesChange(DRAFT, true, T1);
    expect(queued).toEqual(QUEUED_NEW);
    expect(isOnServer(queued)).toBe(false);
    expect(afterUploadConfirmed(queued, false, T2)).toEqual(SYNCED);
  });

  it("turns a change typed while the upload was in flight into an edit", () => {
    expect(afterUploadConfirmed(QUEUED_NEW, true, T2)).toEqual({ kind: "queued-edit", editedAt: T2 });
  });

  it("sends a change to an uploaded reading as an edit, and marks it synced only if it did not change again", () => {
    const edit = afterValuesChange(SYNCED, true, T1);
    expect(edit).toEqual({ kind: "queued-edit", editedAt: T1 });
    expect(afterValuesChange(edit, true, T2)).toEqual({ kind: "queued-edit", editedAt: T2 }); // last change wins
    expect(afterEditConfirmed(edit, true)).toEqual(edit);
    expect(afterEditConfirmed(edit, false)).toEqual(SYNCED);
  });

  it("drops a reading the server never saw, and queues a delete for one it has", () => {
    expect(afterRemove(DRAFT, T1)).toBeNull();
    expect(afterRemove(QUEUED_NEW, T1)).toBeNull();
    expect(afterRemove(refusedNew, T1)).toBeNull();
    const del = afterRemove(SYNCED, T1)!;
    expect(del).toEqual({ kind: "queued-delete", editedAt: T1 });
    expect(isDeleted(del)).toBe(true);
    // An upload confirmed after the delete was asked for keeps the delete.
    expect(afterUploadConfirmed(del, false, T2)).toEqual(del);
    expect(afterEditConfirmed(del, false)).toEqual(del);
  });

  it("keeps what was refused with its reasons, and queues it again once fixed", () => {
    expect(afterRefused(QUEUED_NEW, { ppm: "must be 0 ppm or more" })).toEqual(refusedNew);
    expect(afterValuesChange(refusedNew, false, T2)).toEqual(QUEUED_NEW);
    const refusedEdit = afterRefused({ kind: "queued-edit", editedAt: T1 }, { "": "This sweep was already reviewed." });
    expect(refusedEdit).toMatchObject({ kind: "refused", change: "edit", editedAt: T1 });
    expect(isOnServer(refusedEdit)).toBe(true);
    expect(afterValuesChange(refusedEdit, true, T2)).toEqual({ kind: "queued-edit", editedAt: T2 });
    const refusedDelete = afterRefused({ kind: "queued-delete", editedAt: T1 }, { "": "reviewed" });
    expect(isDeleted(refusedDelete)).toBe(true);
    expect(afterRemove(refusedDelete, T2)).toEqual({ kind: "queued-delete", editedAt: T2 });
  });

  it("finds every queued kind, and nothing else, in the index's key range", () => {
    const kinds = ["draft", "queued-new", "synced", "queued-edit", "queued-delete", "refused"];
    const [lo, hi] = QUEUED_RANGE;
    expect(kinds.filter((k) => k >= lo && k <= hi).sort()).toEqual(["queued-delete", "queued-edit", "queued-new"]);
  });

  it("reads the flags of readings saved before the union", () => {
    const base = {
      draft: false,
      onServer: false,
      editPending: false,
      deletePending: false,
      editedAt: null,
      reasons: null,
    };
    expect(syncFromLegacy({ ...base, draft: true, state: "draft" }, T2)).toEqual(DRAFT);
    expect(syncFromLegacy({ ...base, state: "pending" }, T2)).toEqual(QUEUED_NEW);
    expect(syncFromLegacy({ ...base, state: "synced", onServer: true }, T2)).toEqual(SYNCED);
    expect(syncFromLegacy({ ...base, state: "pending", onServer: true, editPending: true, editedAt: T1 }, T2)).toEqual({
      kind: "queued-edit",
      editedAt: T1,
    });
    expect(
      syncFromLegacy({ ...base, state: "pending", onServer: true, deletePending: true, editedAt: T1 }, T2),
    ).toEqual({ kind: "queued-delete", editedAt: T1 });
    expect(syncFromLegacy({ ...base, state: "rejected", reasons: { ppm: "must be 0 ppm or more" } }, T2)).toEqual(
      refusedNew,
    );
  });
});

describe("a sweep's sync state", () => {
  it("holds a submit asked for offline until the sweep is created, then until it is sent", () => {
    const asked = afterSubmitAsked({ kind: "queued-new", thenSubmit: false });
    expect(asked).toEqual({ kind: "queued-new", thenSubmit: true });
    expect(sweepStateText("in-progress", asked)).toBe("submit waits to upload");
    expect(afterSweepCreated(asked)).toEqual({ kind: "queued-submit" });
    expect(afterSweepCreated({ kind: "queued-new", thenSubmit: false })).toEqual({ kind: "on-server" });
    expect(afterSweepRefused(asked, { planId: "was removed" })).toEqual({
      kind: "refused",
      reasons: { planId: "was removed" },
      thenSubmit: true,
    });
  });

  it("says submitted once the server has the submit, never still submitting", () => {
    expect(sweepStateText("submitted", { kind: "on-server" })).toBe("submitted");
    expect(sweepStateText("in-progress", { kind: "on-server" })).toBe("");
  });

  it("reads the flags of sweeps saved before the union", () => {
    expect(sweepSyncFromLegacy({ onServer: false, submitPending: false, rejected: null })).toEqual({
      kind: "queued-new",
      thenSubmit: false,
    });
    expect(sweepSyncFromLegacy({ onServer: true, submitPending: true, rejected: null })).toEqual({
      kind: "queued-submit",
    });
    expect(sweepSyncFromLegacy({ onServer: false, submitPending: false, rejected: { planId: "x" } })).toMatchObject({
      kind: "refused",
    });
  });
});
