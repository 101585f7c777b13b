import type { SweepPass } from "#core/contracts/sweeps";
import { passAirWords } from "#core/domain/sweeps/pass-words";

/**
 * Under the field map of a sweep with pinpoint passes: which taps are whose. Readings of pass 1 (the
 * sweep's own conditions) are drawn as circles, those of pinpoint passes as squares.
 */
export function PassKey({
  sweep,
  name,
  time,
}: {
  sweep: { fans: "running" | "stopped"; defrost: boolean; passes: readonly SweepPass[] };
  name: (fixtureId: string) => string;
  time: (iso: string) => string;
}) {
  if (sweep.passes.length === 0) return null;
  return (
    <section aria-label="Passes" className="rounded-md bg-surface px-4 py-3 text-sm edge" data-testid="pass-key">
      <h2 className="font-bold">Passes</h2>
      <ul className="mt-1 space-y-1">
        <li>
          <span aria-hidden="true">○</span> Pass 1 (circles): fans {sweep.fans}
          {sweep.defrost ? ", in defrost" : ""}
        </li>
        {sweep.passes.map((p) => (
          <li key={p.id}>
            <span aria-hidden="true">□</span> Pass {p.number} (squares): {passAirWords(p, name)}, {time(p.startedAt)}–
            {p.endedAt ? time(p.endedAt) : "not ended"}
          </li>
        ))}
      </ul>
    </section>
  );
}
