/**
 * The words for a sweep's passes on the report and the field map: the first pass is the sweep's own
 * conditions, pinpoint passes are numbered 2, 3, … in order of start (decision 0110).
 */
export interface PassFacts {
  id: string;
  fans: "running" | "stopped";
  defrost: boolean;
  fixtureId: string | null;
  startedAt: Date;
  endedAt: Date | null;
}

/** "fans stopped" or "in defrost" (a defrost stops the fans), over a fixture or the whole store. */
export function passAirWords(p: Pick<PassFacts, "fans" | "defrost" | "fixtureId">, name: (id: string) => string) {
  const air = p.defrost ? "in defrost" : `fans ${p.fans}`;
  return p.fixtureId ? `${air} at ${name(p.fixtureId)}` : `${air}, whole store`;
}

/** The report's conditions line: the first pass, then each pinpoint pass with its times. */
export function sweepConditionsWords(
  sweep: { fans: "running" | "stopped"; defrost: boolean },
  passes: readonly PassFacts[],
  name: (id: string) => string,
  time: (d: Date) => string,
): string {
  const first = `fans ${sweep.fans}${sweep.defrost ? ", in defrost" : ""}`;
  if (passes.length === 0) return first;
  const later = passes.map(
    (p, i) =>
      `pass ${i + 2}: ${passAirWords(p, name)}, ${time(p.startedAt)}–${p.endedAt ? time(p.endedAt) : "not ended"}`,
  );
  return [`pass 1: ${first}`, ...later].join("; ");
}

/** Pass number of each pinpoint pass id (2, 3, …); a reading of none is in pass 1. */
export function passNumberOf(passes: readonly Pick<PassFacts, "id">[]): (passId: string | null) => number {
  const numbers = new Map(passes.map((p, i) => [p.id, i + 2]));
  return (passId) => (passId ? (numbers.get(passId) ?? 1) : 1);
}
