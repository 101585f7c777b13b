import { isApiRequestError } from "../../lib/api-client";
import { Alert } from "./alert";
import { Button } from "./button";

/** A failed load, in words, with a way to try again. */
export function QueryError({ error, onRetry, what }: { error: unknown; onRetry?: () => void; what: string }) {
  const message = isApiRequestError(error) ? error.message : "Something went wrong.";
  return (
    <Alert tone="error" title={`Could not load ${what}`}>
      <p>{message}</p>
      {onRetry ? (
        <Button variant="secondary" className="mt-2" onClick={onRetry}>
          Try again
        </Button>
      ) : null}
    </Alert>
  );
}
