import { useMemo, useState } from "react";
import { Button } from "../../../components/ui/button";
import { Dialog } from "../../../components/ui/dialog";
import { Select } from "../../../components/ui/select";
import { alignLog, readLogSamples, readLogTable, type LogTable, type TapPosition } from "../model/detector-log";
import type { ReadingValues } from "../model/local-types";

function guess(headers: string[], words: RegExp, fallback: number): number {
  const i = headers.findIndex((h) => words.test(h));
  return i >= 0 ? i : fallback;
}

/**
 * A detector's own data log (CSV of time and ppm): map the columns, slide the clock offset until
 * the log lines up with the taps, see which rows cannot be used and why, then add the rest.
 */
export function LogImport(props: {
  open: boolean;
  taps: readonly TapPosition[];
  sweepStartMs: number;
  onImport(readings: ReadingValues[]): void;
  onClose(): void;
}) {
  const [table, setTable] = useState<LogTable | null>(null);
  const [fileError, setFileError] = useState<string | null>(null);
  const [timeCol, setTimeCol] = useState(0);
  const [ppmCol, setPpmCol] = useState(1);
  const [offset, setOffset] = useState(0);

  async function choose(file: File | undefined) {
    if (!file) return;
    setFileError(null);
    if (file.size > 5_000_000) {
      setFileError("The file is larger than 5 MB; a detector log of a sweep is far smaller. Choose the right file.");
      return;
    }
    const t = readLogTable(await file.text());
    if (t.headers.length < 2) {
      setFileError("The file needs a header row and at least two columns (time and ppm).");
      return;
    }
    setTable(t);
    setTimeCol(guess(t.headers, /time|date|elapsed|sec/i, 0));
    setPpmCol(guess(t.headers, /ppm|gas|conc|value|level/i, 1));
  }

  const result = useMemo(() => {
    if (!table) return null;
    const read = readLogSamples(table, timeCol, ppmCol, props.sweepStartMs);
    const aligned = alignLog(read.samples, props.taps, offset);
    return { placed: aligned.placed, bad: [...read.bad, ...aligned.bad].sort((a, b) => a.line - b.line) };
  }, [table, timeCol, ppmCol, offset, props.taps, props.sweepStartMs]);

  const columns = (table?.headers ?? []).map((h, i) => ({ value: String(i), label: h || `Column ${i + 1}` }));
  const step = (d: number) => setOffset((o) => Math.round((o + d) * 10) / 10);

  return (
    <Dialog title="Import the detector's log" open={props.open} onClose={props.onClose} wide>
      <p>
        Readings from the log are placed on the path you tapped, by time. Tap the positions first, then import the log.
      </p>
      <label className="block">
        <span className="font-bold">CSV file</span>
        <input
          type="file"
          accept=".csv,text/csv,text/plain"
          onChange={(e) => void choose(e.target.files?.[0])}
          className="mt-1 block min-h-12 w-full"
        />
      </label>
      {fileError ? <p className="text-danger">{fileError}</p> : null}
      {table ? (
        <>
          <div className="grid gap-2 sm:grid-cols-2">
            <Select
              label="Time column"
              value={String(timeCol)}
              onChange={(e) => setTimeCol(Number(e.target.value))}
              options={columns}
            />
            <Select
              label="ppm column"
              value={String(ppmCol)}
              onChange={(e) => setPpmCol(Number(e.target.value))}
              options={columns}
            />
          </div>
          <fieldset>
            <legend className="font-bold">Clock offset (added to the log's times)</legend>
            <div className="flex items-center gap-2">
              {[-10, -1].map((d) => (
                <Button key={d} variant="secondary" className="min-h-12" onClick={() => step(d)}>
                  {d} s
                </Button>
              ))}
              <input
                aria-label="Clock offset in seconds"
                type="number"
                step="0.1"
                value={offset}
                onChange={(e) => setOffset(Number(e.target.value) || 0)}
                className="min-h-12 w-24 rounded-md px-2 text-center edge"
              />
              {[1, 10].map((d) => (
                <Button key={d} variant="secondary" className="min-h-12" onClick={() => step(d)}>
                  +{d} s
                </Button>
              ))}
            </div>
          </fieldset>
          {result ? (
            <>
              <p className="font-bold" data-testid="import-counts">
                {result.placed.length} rows can be placed; {result.bad.length} cannot.
              </p>
              {result.bad.length ? (
                <ul className="max-h-40 overflow-auto text-danger" aria-label="Rows that cannot be used">
                  {result.bad.slice(0, 200).map((b) => (
                    <li key={b.line}>
                      Line {b.line}: {b.reason}
                    </li>
                  ))}
                </ul>
              ) : null}
              <Button
                disabled={result.placed.length === 0}
                className="min-h-12"
                onClick={() =>
                  props.onImport(
                    result.placed.map((p) => ({
                      x: p.x,
                      y: p.y,
                      takenAt: p.takenAt,
                      ppm: p.ppm,
                      atLeast: p.atLeast,
                      samplePoint: p.samplePoint,
                      note: `From the detector's log, line ${p.line}`,
                    })),
                  )
                }
              >
                Add {result.placed.length} readings
              </Button>
            </>
          ) : null}
        </>
      ) : null}
    </Dialog>
  );
}
