import { QueryError } from "../../../components/ui/query-error";
import { Spinner } from "../../../components/ui/spinner";
import { useReadings } from "../api/get-readings";

/**
 * Every "reading" of the company's rule profile, listed once in plain words: how the product
 * applies a rule whose text it has not confirmed. Each "reading" marker on screens and statements
 * links here; an owner changes a value by starting a custom profile.
 */
export function ReadingsSection() {
  const readings = useReadings();
  return (
    <section id="readings" aria-labelledby="readings-heading" className="space-y-2">
      <h2 id="readings-heading" className="text-xl font-bold">
        Readings
      </h2>
      {readings.isPending ? <Spinner label="Loading readings…" /> : null}
      {readings.isError ? (
        <QueryError error={readings.error} what="the readings" onRetry={() => void readings.refetch()} />
      ) : null}
      {readings.data ? (
        <>
          <p className="max-w-prose text-sm text-muted">
            Where {readings.data.profileName} is applied without the rule text confirmed, the product follows these
            readings; figures marked “reading” use them. The owner accepts them as they are or changes a value in a
            custom profile.
          </p>
          <ul className="max-w-prose list-disc space-y-1 pl-5">
            {readings.data.readings.map((r) => (
              <li key={r.text}>{r.text}</li>
            ))}
          </ul>
        </>
      ) : null}
    </section>
  );
}
