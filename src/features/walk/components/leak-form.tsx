import { useState } from "react";
import { COMPONENT_LABELS, FINDING_COMPONENTS } from "#core/contracts/findings";
import type { Fixture } from "#core/contracts/fixtures";
import { FIXTURE_KIND_NAMES } from "#core/contracts/fixture-kinds";
import { formatLength, type LengthPreference } from "#core/domain/units/format-units";
import { Alert } from "../../../components/ui/alert";
import { Button } from "../../../components/ui/button";
import { Dialog } from "../../../components/ui/dialog";
import { Select } from "../../../components/ui/select";
import { refreshCounts, syncSoon } from "../hooks/sync-loop";
import { queueFinding } from "../model/finding-queue";
import { findingSystemId } from "../model/finding-system";
import { walkDb } from "../model/walk-db";
import type { LeakSpot } from "../model/walk-mode";

/** "Leak found here": position (from the tap), fixture, component, status, photo and note. */
export function LeakForm(props: {
  spot: LeakSpot | null;
  storeId: string;
  planId: string;
  sweepId: string;
  fixtures: readonly Fixture[];
  /** The store's systems in service (the device's copy): a leak is never recorded on a retired one. */
  inServiceSystemIds: ReadonlySet<string>;
  lengthUnit?: LengthPreference;
  onClose(): void;
  onSaved(id: string): void;
}) {
  const [fixtureId, setFixtureId] = useState(props.spot?.fixtureId ?? "");
  const [component, setComponent] = useState<string>("");
  const [status, setStatus] = useState<"suspected" | "confirmed">("confirmed");
  const [note, setNote] = useState("");
  const [photo, setPhoto] = useState<File | null>(null);
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const len = (m: number) => formatLength(m, props.lengthUnit ?? "m", { decimals: 1 });
  const options = [
    { value: "", label: "No fixture" },
    ...props.fixtures
      .filter((f) => f.kind !== "wall" && f.kind !== "column")
      .map((f) => ({ value: f.id, label: f.label || FIXTURE_KIND_NAMES[f.kind] })),
  ];

  async function save() {
    if (!props.spot) return;
    // Checked here as the server does, so a queued finding is not refused later, out of sight.
    if (status === "confirmed" && !component) {
      setError("Component: is required when the leak is confirmed (or choose Suspected).");
      return;
    }
    setBusy(true);
    setError(null);
    try {
      // On the device first, like a reading: it uploads (with its photo) once its sweep is on the
      // server, and waits in the queue while offline.
      const clientId = crypto.randomUUID();
      await queueFinding(
        await walkDb(),
        props.storeId,
        {
          clientId,
          source: "walk",
          status,
          planId: props.planId,
          sweepId: props.sweepId,
          fixtureId: fixtureId || null,
          systemId: findingSystemId(props.fixtures, fixtureId || null, props.inServiceSystemIds),
          x: props.spot.x,
          y: props.spot.y,
          component: (component || null) as never,
          note,
          foundAt: new Date().toISOString(),
        },
        photo
          ? { name: photo.name || "photo.jpg", type: photo.type || "image/jpeg", data: await photo.arrayBuffer() }
          : null,
      );
      await refreshCounts();
      syncSoon(0);
      props.onSaved(clientId);
    } catch (e) {
      setError(e instanceof Error ? e.message : String(e));
    } finally {
      setBusy(false);
    }
  }

  return (
    <Dialog title="Leak found here" open={props.spot !== null} onClose={props.onClose}>
      {props.spot ? (
        <p className="text-muted">
          {len(props.spot.x)} across and {len(props.spot.y)} down from the plan's top-left corner.
        </p>
      ) : null}
      <Select label="Fixture" value={fixtureId} onChange={(e) => setFixtureId(e.target.value)} options={options} />
      <Select
        label="Component"
        value={component}
        onChange={(e) => setComponent(e.target.value)}
        options={[
          { value: "", label: "Not known yet" },
          ...FINDING_COMPONENTS.map((c) => ({ value: c, label: COMPONENT_LABELS[c] })),
        ]}
      />
      <fieldset>
        <legend className="font-bold">Status</legend>
        <div className="flex gap-2">
          {(["confirmed", "suspected"] as const).map((s) => (
            <label
              key={s}
              className={`flex min-h-12 flex-1 items-center justify-center gap-2 rounded-md font-bold edge ${status === s ? "bg-accent text-on-accent" : ""}`}
            >
              <input
                type="radio"
                name="leak-status"
                value={s}
                checked={status === s}
                onChange={() => setStatus(s)}
                className="size-5"
              />
              {s === "confirmed" ? "Confirmed (pinpointed)" : "Suspected"}
            </label>
          ))}
        </div>
      </fieldset>
      <div>
        <span className="font-bold">Photo</span>
        {/* The native file control is a small target; a large labelled one opens the camera. */}
        <label className="mt-1 flex min-h-12 cursor-pointer items-center justify-center rounded-md px-3 font-bold edge focus-within:ring-2 focus-within:ring-accent">
          <input
            type="file"
            accept="image/*"
            capture="environment"
            onChange={(e) => setPhoto(e.target.files?.[0] ?? null)}
            className="sr-only"
          />
          {photo ? `Photo: ${photo.name || "from the camera"} — change` : "Take or choose a photo"}
        </label>
      </div>
      <label className="block">
        <span className="font-bold">Note</span>
        <textarea
          value={note}
          onChange={(e) => setNote(e.target.value)}
          maxLength={2000}
          rows={2}
          className="mt-1 block w-full rounded-md p-2 edge"
        />
      </label>
      {error ? (
        <Alert tone="error" title="Not saved">
          {error}
        </Alert>
      ) : null}
      <div className="flex gap-2">
        <Button onClick={() => void save()} busy={busy} className="min-h-12">
          Save finding
        </Button>
        <Button variant="secondary" onClick={props.onClose} className="min-h-12">
          Cancel
        </Button>
      </div>
    </Dialog>
  );
}
