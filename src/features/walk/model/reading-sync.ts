/**
 * Where a reading stands between this device and the server, as ONE union: the sync queue, the
 * readings list, the plan's marks and the banner all read this, and every change goes through the
 * pure steps below, so no combination of flags can say two things at once.
 */
export type ReadingSync =
  /** Still on the keypad: kept on the device, never uploaded until its value is confirmed. */
  | { kind: "draft" }
  /** Confirmed; waits for its first upload. */
  | { kind: "queued-new" }
  /** The server holds it exactly as this device does. */
  | { kind: "synced" }
  /** Changed after the server had it; the change waits to be sent (audited there). */
  | { kind: "queued-edit"; editedAt: string }
  /** Deleted here; the server still has it until the delete is sent. */
  | { kind: "queued-delete"; editedAt: string }
  /** The server refused the change, with a reason per field; kept on the device for fixing. */
  | { kind: "refused"; change: "new" | "edit" | "delete"; reasons: Record<string, string>; editedAt: string | null };

/** The kinds the queue sends share the prefix "queued-", so one key range of the index finds them all. */
export const QUEUED_RANGE: [string, string] = ["queued-", "queued-\uffff"];

export const DRAFT: ReadingSync = { kind: "draft" };
export const QUEUED_NEW: ReadingSync = { kind: "queued-new" };
export const SYNCED: ReadingSync = { kind: "synced" };

/** True when the server holds some version of the reading (so a change must travel as an edit or a delete). */
export function isOnServer(s: ReadingSync): boolean {
  if (s.kind === "refused") return s.change !== "new";
  return s.kind === "synced" || s.kind === "queued-edit" || s.kind === "queued-delete";
}

export function isQueued(s: ReadingSync): boolean {
  return s.kind === "queued-new" || s.kind === "queued-edit" || s.kind === "queued-delete";
}

/** Deleted on this device (the delete waits or was refused): no longer part of the sweep shown. */
export function isDeleted(s: ReadingSync): boolean {
  return s.kind === "queued-delete" || (s.kind === "refused" && s.change === "delete");
}

/**
 * Values changed on the device (typed, moved, fixed after a refusal). `commit` confirms an open
 * reading (the keypad's Save, the next tap, Submit, leaving the screen).
 */
export function afterValuesChange(s: ReadingSync, commit: boolean, now: string): ReadingSync {
  switch (s.kind) {
    case "draft":
      return commit ? QUEUED_NEW : s;
    case "queued-new":
      return s;
    case "synced":
    case "queued-edit":
      return { kind: "queued-edit", editedAt: now };
    case "queued-delete":
      return s;
    case "refused":
      if (s.change === "new") return QUEUED_NEW;
      if (s.change === "edit") return { kind: "queued-edit", editedAt: now };
      return { kind: "queued-delete", editedAt: now };
  }
}

/** Undo or delete: null when the row can simply go (the server never saw it). */
export function afterRemove(s: ReadingSync, now: string): ReadingSync | null {
  return isOnServer(s) ? { kind: "queued-delete", editedAt: now } : null;
}

/**
 * The server confirmed an upload (stored now or already). `changedSince`: the values on the device
 * are no longer those sent (typed while the upload was in flight), so they follow as an edit.
 */
export function afterUploadConfirmed(s: ReadingSync, changedSince: boolean, now: string): ReadingSync {
  if (s.kind === "queued-delete") return s; // deleted meanwhile: the delete follows
  return changedSince ? { kind: "queued-edit", editedAt: now } : SYNCED;
}

/** The server sent an edit; the reading is synced unless it changed again meanwhile. */
export function afterEditConfirmed(s: ReadingSync, changedSince: boolean): ReadingSync {
  if (s.kind !== "queued-edit" || changedSince) return s;
  return SYNCED;
}

/** The server refused the change that was queued. */
export function afterRefused(s: ReadingSync, reasons: Record<string, string>): ReadingSync {
  const change = s.kind === "queued-edit" ? "edit" : s.kind === "queued-delete" ? "delete" : "new";
  const editedAt = s.kind === "queued-edit" || s.kind === "queued-delete" ? s.editedAt : null;
  return { kind: "refused", change, reasons, editedAt };
}

/** The time stamp an edit or a delete carries to the server (last received wins, decision 0016). */
export function editedAtOf(s: ReadingSync): string | null {
  return s.kind === "queued-edit" || s.kind === "queued-delete" || s.kind === "refused" ? s.editedAt : null;
}

/** The flags readings carried before the union (walk database version 3 and earlier). */
export interface LegacyReadingFlags {
  draft?: boolean;
  state?: string;
  onServer?: boolean;
  editPending?: boolean;
  deletePending?: boolean;
  editedAt?: string | null;
  reasons?: Record<string, string> | null;
}

/** Reads the old flags of a reading already on a device into the union (the version 4 upgrade). */
export function syncFromLegacy(r: LegacyReadingFlags, now: string): ReadingSync {
  const editedAt = r.editedAt ?? null;
  if (r.draft || r.state === "draft") return DRAFT;
  if (r.state === "rejected") {
    const change = r.deletePending ? "delete" : r.onServer ? "edit" : "new";
    return { kind: "refused", change, reasons: r.reasons ?? { "": "refused by the server" }, editedAt };
  }
  if (!r.onServer) return QUEUED_NEW;
  if (r.deletePending) return { kind: "queued-delete", editedAt: editedAt ?? now };
  if (r.editPending || r.state === "pending") return { kind: "queued-edit", editedAt: editedAt ?? now };
  return SYNCED;
}
