import { formatInZone } from "#core/domain/dates/format-in-zone";

// Moments that belong to no store (invitations, mail) in the reader's own zone, written the one
// way every time is written (core/domain/dates/format-in-zone.ts).
const readerZone = () => Intl.DateTimeFormat().resolvedOptions().timeZone || "UTC";

export function formatDate(iso: string): string {
  return formatInZone(iso, readerZone(), "date");
}

export function formatDateTime(iso: string): string {
  return formatInZone(iso, readerZone(), "dateTime");
}

export function formatBytes(bytes: number): string {
  if (bytes < 1024) return `${bytes} B`;
  if (bytes < 1024 * 1024) return `${(bytes / 1024).toFixed(1)} kB`;
  return `${(bytes / (1024 * 1024)).toFixed(1)} MB`;
}

/** "1 reading", "3 readings": a count with its noun in the right number. */
export function countOf(n: number, singular: string, plural = `${singular}s`): string {
  return `${n} ${n === 1 ? singular : plural}`;
}
