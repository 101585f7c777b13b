import { useEffect, useState } from "react";
import {
  FIXTURE_FAMILY,
  FIXTURE_FAMILY_NAMES,
  FIXTURE_KIND_NAMES,
  FIXTURE_KINDS,
  isPointKind,
  type FixtureKind,
} from "#core/contracts/fixture-kinds";
import type { Fixture, RoomDoor } from "#core/contracts/fixtures";
import { LABEL_MAX, NOTE_MAX } from "#core/contracts/fixtures";
import { formatLength, type LengthPreference } from "#core/domain/units/format-units";
import { toMetres } from "#core/analysis/geometry/units";
import { Checkbox } from "../../../../components/ui/checkbox";
import { Select } from "../../../../components/ui/select";
import { TextField } from "../../../../components/ui/text-field";
import { label as labelAction, setKind, setProperties, type SceneAction } from "../../model/actions";
import { edgeLength } from "../../model/fixture-geometry";
import { readLengthEntry } from "../../model/length-entry";

export interface SystemOption {
  id: string;
  name: string;
}

interface Props {
  selection: readonly Fixture[];
  systems: readonly SystemOption[];
  preference: LengthPreference;
  canEdit: boolean;
  apply: (actions: readonly SceneAction[], gesture?: string | null) => void;
}

function kindOptions(pointFamily: boolean) {
  return FIXTURE_KINDS.filter((k) => isPointKind(k) === pointFamily).map((k) => ({
    value: k,
    label: `${FIXTURE_KIND_NAMES[k]} (${FIXTURE_FAMILY_NAMES[FIXTURE_FAMILY[k]]})`,
  }));
}

/** A text field that applies on blur or Enter, so typing is one undo step, not one per key. */
function CommitField({
  label,
  value,
  onCommit,
  hint,
  error,
  disabled,
  inputMode,
}: {
  label: string;
  value: string;
  onCommit: (v: string) => string | null;
  hint?: string;
  error?: string;
  disabled?: boolean;
  inputMode?: "decimal" | "numeric";
}) {
  const [text, setText] = useState(value);
  const [problem, setProblem] = useState<string | null>(null);
  useEffect(() => {
    setText(value);
    setProblem(null);
  }, [value]);
  const commit = () => {
    if (text !== value) setProblem(onCommit(text));
  };
  return (
    <TextField
      label={label}
      value={text}
      hint={hint}
      disabled={disabled}
      inputMode={inputMode}
      error={problem ?? error}
      onChange={(e) => setText(e.target.value)}
      onBlur={commit}
      onKeyDown={(e) => {
        if (e.key === "Enter") commit();
        e.stopPropagation(); // typing is not an editor shortcut
      }}
    />
  );
}

/** Edits the selected fixtures' properties; with several selected, only what they share. */
export function PropertiesPanel({ selection, systems, preference, canEdit, apply }: Props) {
  if (selection.length === 0) {
    return (
      <p className="text-muted">
        Select a fixture on the plan or in the list to edit it. Shift-click or drag a box to select several.
      </p>
    );
  }
  const ids = selection.map((f) => f.id);
  const first = selection[0];
  const single = selection.length === 1 ? first : null;
  const allPoints = selection.every((f) => "point" in f);
  const noPoints = selection.every((f) => !("point" in f));
  const sameKind = selection.every((f) => f.kind === first.kind);
  const systemValue = selection.every((f) => f.systemId === first.systemId) ? (first.systemId ?? "") : "mixed";
  const fansValue = selection.every((f) => f.hasFans === first.hasFans) ? first.hasFans : null;

  return (
    <div className="space-y-3">
      <p className="font-bold">{single ? FIXTURE_KIND_NAMES[single.kind] : `${selection.length} fixtures selected`}</p>
      {allPoints || noPoints ? (
        <Select
          label="Kind"
          disabled={!canEdit}
          value={sameKind ? first.kind : ""}
          options={[...(sameKind ? [] : [{ value: "", label: "Mixed kinds" }]), ...kindOptions(allPoints)]}
          onChange={(e) => e.target.value && apply([setKind(ids, e.target.value as FixtureKind)])}
        />
      ) : null}
      {single ? (
        <CommitField
          label="Label"
          value={single.label}
          disabled={!canEdit}
          hint="Shown on the plan, e.g. Dairy 3"
          onCommit={(v) => {
            if (v.length > LABEL_MAX) return `must be at most ${LABEL_MAX} characters`;
            apply([labelAction(single.id, v)]);
            return null;
          }}
        />
      ) : null}
      <Select
        label="System"
        disabled={!canEdit}
        value={systemValue}
        options={[
          ...(systemValue === "mixed" ? [{ value: "mixed", label: "Different systems" }] : []),
          { value: "", label: "No system" },
          ...systems.map((s) => ({ value: s.id, label: s.name })),
        ]}
        onChange={(e) =>
          e.target.value !== "mixed" && apply([setProperties(ids, { systemId: e.target.value || null })])
        }
      />
      <Checkbox
        label={fansValue === null ? "Has fans (some do)" : "Has fans"}
        disabled={!canEdit}
        checked={fansValue ?? false}
        onChange={(e) => apply([setProperties(ids, { hasFans: e.target.checked })])}
      />
      {single?.kind === "door-case" ? (
        <CommitField
          label="Door count"
          inputMode="numeric"
          disabled={!canEdit}
          value={String(single.doorCount)}
          onCommit={(v) => {
            const n = Number(v);
            if (!(Number.isInteger(n) && n >= 1 && n <= 100)) return "must be a whole number from 1 to 100";
            apply([setProperties([single.id], { doorCount: n })]);
            return null;
          }}
        />
      ) : null}
      {single && "door" in single ? (
        <DoorFields fixture={single} preference={preference} canEdit={canEdit} apply={apply} />
      ) : null}
      {single?.kind === "benign-zone" ? (
        <>
          <CommitField
            label="Note"
            hint="What reads here that is no leak, e.g. aerosol storage"
            disabled={!canEdit}
            value={single.note}
            onCommit={(v) => {
              if (v.length > NOTE_MAX) return `must be at most ${NOTE_MAX} characters`;
              apply([setProperties([single.id], { note: v })]);
              return null;
            }}
          />
          <CommitField
            label="Typical reading (ppm)"
            inputMode="decimal"
            disabled={!canEdit}
            value={single.typicalPpm === null ? "" : String(single.typicalPpm)}
            onCommit={(v) => {
              if (v.trim() === "") {
                apply([setProperties([single.id], { typicalPpm: null })]);
                return null;
              }
              const n = Number(v);
              if (!(Number.isFinite(n) && n >= 0)) return "must be 0 ppm or more, or empty";
              apply([setProperties([single.id], { typicalPpm: n })]);
              return null;
            }}
          />
        </>
      ) : null}
    </div>
  );
}

function DoorFields({
  fixture,
  preference,
  canEdit,
  apply,
}: {
  fixture: Extract<Fixture, { door: RoomDoor | null }>;
  preference: LengthPreference;
  canEdit: boolean;
  apply: Props["apply"];
}) {
  const door = fixture.door;
  const edges = fixture.polygon.map((_, i) => ({
    value: String(i),
    label: `Edge ${i + 1} (${formatLength(edgeLength(fixture.polygon, i), preference, { decimals: 2 })})`,
  }));
  const setDoor = (next: RoomDoor | null) => apply([setProperties([fixture.id], { door: next })]);
  const parse = (v: string) => {
    const r = readLengthEntry(v, preference, { allowZero: true });
    return r.ok ? toMetres(r.length.value, r.length.unit) : r.message;
  };
  return (
    <fieldset className="space-y-2 rounded-md p-3 edge">
      <legend className="px-1 font-bold">Door</legend>
      <p className="text-sm text-muted">
        The room's walls block air except at its door. Until a door is marked, the room counts as sealed.
      </p>
      <Select
        label="Door on"
        disabled={!canEdit}
        value={door ? String(door.edge) : ""}
        options={[{ value: "", label: "No door marked (sealed)" }, ...edges]}
        onChange={(e) => {
          if (e.target.value === "") return setDoor(null);
          const edge = Number(e.target.value);
          const length = edgeLength(fixture.polygon, edge);
          const width = Math.min(door?.width ?? 1, length);
          setDoor({ edge, width, offset: (length - width) / 2 });
        }}
      />
      {door ? (
        <>
          <CommitField
            label="Offset from the edge's start"
            disabled={!canEdit}
            value={formatLength(door.offset, preference, { decimals: 2 })}
            onCommit={(v) => {
              const m = parse(v);
              if (typeof m === "string") return m;
              setDoor({ ...door, offset: m });
              return null;
            }}
          />
          <CommitField
            label="Door width"
            disabled={!canEdit}
            value={formatLength(door.width, preference, { decimals: 2 })}
            onCommit={(v) => {
              const m = parse(v);
              if (typeof m === "string") return m;
              if (m <= 0) return "must be more than 0";
              setDoor({ ...door, width: m });
              return null;
            }}
          />
        </>
      ) : null}
    </fieldset>
  );
}
