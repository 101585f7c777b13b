import { Alert } from "../../../components/ui/alert";
import { Button } from "../../../components/ui/button";
import { QueryError } from "../../../components/ui/query-error";
import { Spinner } from "../../../components/ui/spinner";
import { formErrorMessage } from "../../../lib/form-errors";
import { useCustomProfile, useStartCustomProfile } from "../api/custom-profile";
import { CustomProfileEditor } from "./custom-profile-editor";

const STARTS = [
  { from: "us-federal", label: "US federal (40 CFR 82 / 84)" },
  { from: "eu-fgas", label: "EU F-gas (2024/573)" },
] as const;

/** The company's own rule profile: started from a copy of a built-in one, edited by owners. */
export function CustomProfileSection({ editable }: { editable: boolean }) {
  const q = useCustomProfile();
  const start = useStartCustomProfile();
  const startError = formErrorMessage(start.error);
  return (
    <section aria-labelledby="custom-profile-heading" className="mt-10 space-y-4">
      <h2 id="custom-profile-heading" className="text-xl font-bold">
        Custom rule profile
      </h2>
      <p className="max-w-prose text-muted">
        A company or state rule stricter than the law: start from a copy of a built-in profile and change thresholds,
        deadlines and intervals, each with its source. It is used wherever the rule profile above is set to Custom.
        Local codes and certified practice still apply.
      </p>
      {q.isPending ? <Spinner label="Loading the custom profile…" /> : null}
      {q.isError ? <QueryError error={q.error} what="the custom profile" onRetry={() => void q.refetch()} /> : null}
      {startError ? <Alert tone="error">{startError}</Alert> : null}
      {q.data ? (
        <>
          {q.data.profile ? (
            <p className="text-sm">
              {q.data.inForce ? (
                <strong>In force. </strong>
              ) : (
                <strong>Not in force (the rule profile above is not Custom). </strong>
              )}
              Last saved {q.data.savedAt ? `${q.data.savedAt.slice(0, 16).replace("T", " ")} UTC` : ""} by{" "}
              {q.data.savedBy ?? "unknown"}; based on {q.data.profile.basedOn === "eu-fgas" ? "EU F-gas" : "US federal"}
              .
            </p>
          ) : (
            <p>No custom profile yet{editable ? "." : "; an owner can start one."}</p>
          )}
          {editable ? (
            <div className="flex flex-wrap gap-2">
              {STARTS.map((s) => (
                <Button
                  key={s.from}
                  variant="secondary"
                  busy={start.isPending && start.variables === s.from}
                  onClick={() => {
                    if (
                      q.data.profile &&
                      !window.confirm(
                        `Start over from ${s.label}? Your edits are kept in the history but replaced here.`,
                      )
                    )
                      return;
                    start.mutate(s.from);
                  }}
                >
                  {q.data.profile ? `Start over from ${s.label}` : `Start from ${s.label}`}
                </Button>
              ))}
            </div>
          ) : null}
          {/* A fresh editor per saved version, so a start-over shows the new copy's values. */}
          {q.data.profile ? (
            <CustomProfileEditor key={start.data?.savedAt ?? "first"} profile={q.data.profile} editable={editable} />
          ) : null}
        </>
      ) : null}
    </section>
  );
}
