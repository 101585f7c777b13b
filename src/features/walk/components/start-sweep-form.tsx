import { useQueryClient } from "@tanstack/react-query";
import { useEffect, useMemo, useState } from "react";
import { refrigerantOfSummary } from "#core/domain/refrigerants/company-refrigerant";
import { startWarnings } from "#core/domain/sweeps/start-warnings";
import { Alert } from "../../../components/ui/alert";
import { Button } from "../../../components/ui/button";
import { QueryError } from "../../../components/ui/query-error";
import { Select } from "../../../components/ui/select";
import { Spinner } from "../../../components/ui/spinner";
import { fetchPlanPack, useStorePack } from "../api/store-pack";
import { syncNow } from "../hooks/sync-loop";
import type { LocalSweep } from "../model/local-types";
import { saveSweep } from "../model/reading-store";
import { SWEEP_QUEUED_NEW } from "../model/sweep-sync";
import { walkDb } from "../model/walk-db";
import { formatDateTime } from "../../../lib/format";

/**
 * Start a sweep: plan version, detector, hunted systems and conditions. The sweep is made on the
 * device first (client-made id), so it starts the same with or without a connection.
 */
export function StartSweepForm({ storeId, onStarted }: { storeId: string; onStarted(sweepId: string): void }) {
  const pack = useStorePack(storeId);
  const queryClient = useQueryClient();
  const [planId, setPlanId] = useState("");
  const [detectorId, setDetectorId] = useState("");
  const [systemIds, setSystemIds] = useState<string[]>([]);
  const [fans, setFans] = useState<"running" | "stopped">("running");
  const [defrost, setDefrost] = useState(false);
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const data = pack.data;

  useEffect(() => {
    if (!data) return;
    if (!planId && data.currentPlan) setPlanId(data.currentPlan.id);
    if (!detectorId && data.detectors[0]) setDetectorId(data.detectors[0].id);
    if (systemIds.length === 0 && data.systems.length) setSystemIds(data.systems.map((s) => s.id));
  }, [data]); // eslint-disable-line react-hooks/exhaustive-deps

  const detector = data?.detectors.find((d) => d.id === detectorId);
  const warnings = useMemo(
    () =>
      detector && data
        ? startWarnings(
            detector,
            data.systems.filter((s) => systemIds.includes(s.id)),
            // the store copy's summaries know the company's own refrigerants, offline too
            (id) => {
              const summary = data.systems.find((s) => s.refrigerantId === id)?.refrigerant;
              return summary ? refrigerantOfSummary(summary) : undefined;
            },
          )
        : [],
    [detector, data, systemIds],
  );

  if (pack.isPending) return <Spinner label="Loading the store…" />;
  if (pack.isError || !data)
    return <QueryError error={pack.error} what="this store" onRetry={() => void pack.refetch()} />;
  const calibrated = data.planVersions.filter((p) => p.calibrated);

  async function start() {
    if (!detector) return;
    setBusy(true);
    setError(null);
    try {
      if (!data!.fromCache && planId !== data!.currentPlan?.id) await fetchPlanPack(queryClient, planId);
      const sweep: LocalSweep = {
        id: crypto.randomUUID(),
        storeId,
        planId,
        detectorId,
        detectorName: detector.name,
        systemIds,
        fans,
        defrost,
        startedAt: new Date().toISOString(),
        status: "in-progress",
        transportDelayS: detector.transportDelayS,
        timeConstantS: detector.timeConstantS,
        alarmPpm: detector.alarmPpm,
        warnings,
        sync: SWEEP_QUEUED_NEW,
        passes: [],
      };
      await saveSweep(await walkDb(), sweep);
      void syncNow();
      onStarted(sweep.id);
    } catch (e) {
      setError(e instanceof Error ? e.message : String(e));
      setBusy(false);
    }
  }

  const RADIO = "flex min-h-12 flex-1 items-center justify-center gap-2 rounded-md font-bold edge";
  return (
    <form
      className="flex max-w-xl flex-col gap-4"
      onSubmit={(e) => {
        e.preventDefault();
        void start();
      }}
    >
      {data.fromCache ? (
        <Alert tone="note" title="Offline">
          Using the copy of this store kept on this device ({formatDateTime(data.savedAt)}). The sweep uploads when the
          connection returns.
        </Alert>
      ) : null}
      {calibrated.length === 0 ? (
        <Alert tone="error" title="No calibrated plan">
          This store has no calibrated plan yet; a lead tech must upload and calibrate one first.
        </Alert>
      ) : null}
      <Select
        label="Plan version"
        value={planId}
        onChange={(e) => setPlanId(e.target.value)}
        options={calibrated.map((p) => ({ value: p.id, label: `Version ${p.version} (${p.fixtureCount} fixtures)` }))}
      />
      {data.detectors.length === 0 ? (
        <Alert tone="error" title="No detector">
          Add a detector on the Detectors page first.
        </Alert>
      ) : null}
      <Select
        label="Detector"
        value={detectorId}
        onChange={(e) => setDetectorId(e.target.value)}
        options={data.detectors.map((d) => ({ value: d.id, label: `${d.name}${d.overdue ? " (check overdue)" : ""}` }))}
      />
      <fieldset>
        <legend className="font-bold">Systems hunted</legend>
        <div className="flex flex-col gap-1">
          {data.systems.map((s) => (
            <label key={s.id} className="flex min-h-12 items-center gap-3 rounded-md px-3 edge">
              <input
                type="checkbox"
                className="size-6"
                checked={systemIds.includes(s.id)}
                onChange={(e) =>
                  setSystemIds(e.target.checked ? [...systemIds, s.id] : systemIds.filter((x) => x !== s.id))
                }
              />
              {s.name} · {s.refrigerant.designation}
            </label>
          ))}
        </div>
      </fieldset>
      <fieldset>
        <legend className="font-bold">Fans</legend>
        <div className="flex gap-2">
          {(["running", "stopped"] as const).map((v) => (
            <label key={v} className={`${RADIO} ${fans === v ? "bg-accent text-on-accent" : ""}`}>
              <input type="radio" name="fans" className="size-5" checked={fans === v} onChange={() => setFans(v)} />{" "}
              Fans {v}
            </label>
          ))}
        </div>
      </fieldset>
      <fieldset>
        <legend className="font-bold">Defrost</legend>
        <div className="flex gap-2">
          {[false, true].map((v) => (
            <label key={String(v)} className={`${RADIO} ${defrost === v ? "bg-accent text-on-accent" : ""}`}>
              <input
                type="radio"
                name="defrost"
                className="size-5"
                checked={defrost === v}
                onChange={() => setDefrost(v)}
              />{" "}
              Defrost {v ? "on" : "off"}
            </label>
          ))}
        </div>
      </fieldset>
      {warnings.map((w) => (
        <Alert
          key={w.code + (w.systemId ?? "")}
          tone="note"
          title={
            w.code === "detector-overdue"
              ? "Detector check overdue"
              : w.code === "detector-blind"
                ? "Detector cannot see this refrigerant"
                : "Detector may not see this refrigerant"
          }
        >
          {w.message}
        </Alert>
      ))}
      {error ? (
        <Alert tone="error" title="Not started">
          {error}
        </Alert>
      ) : null}
      <Button type="submit" busy={busy} disabled={!planId || !detectorId} className="min-h-14 text-xl">
        Start the sweep
      </Button>
    </form>
  );
}
