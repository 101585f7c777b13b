import type { DelayCheckWords } from "#core/domain/locator-words/delay-words";
import { formatShort, type NumberFormat } from "#core/domain/numbers/number-format";
import { Alert } from "../../../components/ui/alert";
import { Button } from "../../../components/ui/button";

/**
 * The detector's delay checked against the readings: what they fit, and, for members who may edit
 * detectors, the offer to set the detector's delay to it.
 */
export function DelayCheckPanel(p: {
  words: DelayCheckWords;
  /** The delay this sweep was recorded with (the detector's at its start), s. */
  sweepDelayS: number;
  canUpdate: boolean;
  onUpdate(delayS: number): void;
  busy: boolean;
  updatedTo: number | null;
  error: string | null;
  /** The company's number format. */
  numberFormat: NumberFormat;
}) {
  const seconds = (s: number) => formatShort(s, p.numberFormat);
  const offer = p.words.suggestedDelayS;
  return (
    <section aria-labelledby="delay-check-title" className="rounded-md edge bg-surface p-3" data-testid="delay-check">
      <h3 id="delay-check-title" className="font-bold">
        Delay check
      </h3>
      <p className="mt-1">{p.words.headline}</p>
      <p className="mt-1 text-sm text-muted">{p.words.detail}</p>
      {offer !== null && p.canUpdate && p.updatedTo === null && offer !== p.sweepDelayS ? (
        <div className="mt-2">
          <Button variant="secondary" busy={p.busy} onClick={() => p.onUpdate(offer)}>
            Set the detector's delay to {seconds(offer)} s
          </Button>
        </div>
      ) : null}
      {p.updatedTo !== null ? (
        <div className="mt-2">
          <Alert tone="success">
            The detector's delay is now {seconds(p.updatedTo)} s: sweeps started from now on use it. This sweep keeps
            the {seconds(p.sweepDelayS)} s it was recorded with.
          </Alert>
        </div>
      ) : null}
      {p.error ? (
        <div className="mt-2">
          <Alert tone="error">{p.error}</Alert>
        </div>
      ) : null}
    </section>
  );
}
