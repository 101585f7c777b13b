import { useId } from "react";
import {
  FIXTURE_FAMILY,
  FIXTURE_FAMILY_NAMES,
  FIXTURE_KIND_NAMES,
  FIXTURE_KINDS,
  isPointKind,
  type FixtureFamily,
  type FixtureKind,
} from "#core/contracts/fixture-kinds";
import type { LengthPreference } from "#core/domain/units/format-units";
import { Button } from "../../../../components/ui/button";
import type { ActiveTool } from "../../model/tools/active-tool";

export type DrawShape = "rectangle" | "polygon";

interface Props {
  active: ActiveTool;
  kind: FixtureKind;
  canEdit: boolean;
  canUndo: boolean;
  canRedo: boolean;
  hasSelection: boolean;
  gridM: number | null;
  snapToFixtures: boolean;
  preference: LengthPreference;
  onTool: (tool: "select" | "pan" | "vertex" | DrawShape) => void;
  onKind: (kind: FixtureKind) => void;
  onUndo: () => void;
  onRedo: () => void;
  onDuplicate: () => void;
  onArray: () => void;
  onDelete: () => void;
  onZoom: (direction: "in" | "out" | "fit") => void;
  onGrid: (gridM: number | null) => void;
  onSnapToFixtures: (on: boolean) => void;
}

/** A group of buttons: one unbroken run in the phone's scrolling row, wrapping from `sm` up. */
const GROUP = "flex shrink-0 flex-nowrap gap-1 sm:shrink sm:flex-wrap";

const FAMILIES: FixtureFamily[] = ["air-volume", "solid-body", "zone", "point"];

// Snap steps in the user's units: 0.1 / 0.5 / 1 m, or 6 in / 1 ft / 2 ft (0.3048 m per foot, NIST SP 811).
const GRIDS: Record<LengthPreference, { value: string; label: string }[]> = {
  m: [
    { value: "0.1", label: "10 cm" },
    { value: "0.5", label: "50 cm" },
    { value: "1", label: "1 m" },
  ],
  "ft-in": [
    { value: "0.1524", label: "6 in" },
    { value: "0.3048", label: "1 ft" },
    { value: "0.6096", label: "2 ft" },
  ],
};

function ToolButton({
  pressed,
  onClick,
  children,
  shortcut,
}: {
  pressed: boolean;
  onClick: () => void;
  children: string;
  shortcut: string;
}) {
  return (
    <Button
      variant={pressed ? "primary" : "secondary"}
      aria-pressed={pressed}
      onClick={onClick}
      title={`${children} (${shortcut})`}
      aria-keyshortcuts={shortcut}
    >
      {children}
    </Button>
  );
}

/**
 * Tools, the kind to draw, edits and the view; every button is at least 44 px (Button). On a phone
 * (below Tailwind's `sm`, 640 px) they stay in one row that scrolls sideways under the thumb, so
 * the plan keeps the screen; from `sm` up the groups wrap as the width allows.
 */
export function EditorToolbar(p: Props) {
  const kindId = useId();
  const gridId = useId();
  const drawing = p.active.tool === "rectangle" || p.active.tool === "polygon" || p.active.tool === "point";
  const pointKind = isPointKind(p.kind);
  return (
    <div
      role="toolbar"
      aria-label="Layout tools"
      data-testid="editor-toolbar"
      className="flex min-w-0 flex-1 flex-nowrap items-center gap-2 overflow-x-auto overscroll-x-contain rounded-md bg-surface p-2 edge sm:flex-initial sm:flex-wrap sm:overflow-visible"
    >
      <div className={GROUP} role="group" aria-label="Tool">
        <ToolButton pressed={p.active.tool === "select"} onClick={() => p.onTool("select")} shortcut="V">
          Select
        </ToolButton>
        <ToolButton pressed={p.active.tool === "pan"} onClick={() => p.onTool("pan")} shortcut="H">
          Pan
        </ToolButton>
        {p.canEdit ? (
          <>
            <ToolButton
              pressed={drawing && (p.active.tool === "rectangle" || p.active.tool === "point")}
              onClick={() => p.onTool("rectangle")}
              shortcut="B"
            >
              {pointKind ? "Place point" : "Rectangle"}
            </ToolButton>
            <ToolButton pressed={p.active.tool === "vertex"} onClick={() => p.onTool("vertex")} shortcut="C">
              Corners
            </ToolButton>
            {pointKind ? null : (
              <ToolButton pressed={p.active.tool === "polygon"} onClick={() => p.onTool("polygon")} shortcut="P">
                Outline
              </ToolButton>
            )}
          </>
        ) : null}
      </div>
      {p.canEdit ? (
        <div className="flex shrink-0 items-center gap-2 sm:shrink">
          <label htmlFor={kindId} className="whitespace-nowrap text-sm font-bold">
            Kind to draw
          </label>
          <select
            id={kindId}
            value={p.kind}
            onChange={(e) => p.onKind(e.target.value as FixtureKind)}
            className="block min-h-11 rounded-md bg-surface px-2 edge"
          >
            {FAMILIES.map((fam) => (
              <optgroup key={fam} label={FIXTURE_FAMILY_NAMES[fam]}>
                {FIXTURE_KINDS.filter((k) => FIXTURE_FAMILY[k] === fam).map((k) => (
                  <option key={k} value={k}>
                    {FIXTURE_KIND_NAMES[k]}
                  </option>
                ))}
              </optgroup>
            ))}
          </select>
        </div>
      ) : null}
      {p.canEdit ? (
        <div className={GROUP} role="group" aria-label="Edit">
          <Button variant="secondary" onClick={p.onUndo} disabled={!p.canUndo} aria-keyshortcuts="Control+Z">
            Undo
          </Button>
          <Button variant="secondary" onClick={p.onRedo} disabled={!p.canRedo} aria-keyshortcuts="Control+Shift+Z">
            Redo
          </Button>
          <Button variant="secondary" onClick={p.onDuplicate} disabled={!p.hasSelection} aria-keyshortcuts="Control+D">
            Duplicate
          </Button>
          <Button variant="secondary" onClick={p.onArray} disabled={!p.hasSelection}>
            Array…
          </Button>
          <Button variant="secondary" onClick={p.onDelete} disabled={!p.hasSelection} aria-keyshortcuts="Delete">
            Delete
          </Button>
        </div>
      ) : null}
      <div className={GROUP} role="group" aria-label="View">
        <Button variant="secondary" onClick={() => p.onZoom("in")} aria-label="Zoom in">
          +
        </Button>
        <Button variant="secondary" onClick={() => p.onZoom("out")} aria-label="Zoom out">
          −
        </Button>
        <Button variant="secondary" onClick={() => p.onZoom("fit")}>
          Fit
        </Button>
      </div>
      {p.canEdit ? (
        <div className="flex shrink-0 items-center gap-2 sm:shrink sm:flex-wrap">
          <div className="flex shrink-0 items-center gap-2 sm:shrink">
            <label htmlFor={gridId} className="whitespace-nowrap text-sm font-bold">
              Snap to grid
            </label>
            <select
              id={gridId}
              value={p.gridM === null ? "" : String(p.gridM)}
              onChange={(e) => p.onGrid(e.target.value === "" ? null : Number(e.target.value))}
              className="block min-h-11 rounded-md bg-surface px-2 edge"
            >
              <option value="">Off</option>
              {GRIDS[p.preference].map((g) => (
                <option key={g.value} value={g.value}>
                  {g.label}
                </option>
              ))}
            </select>
          </div>
          <label className="flex min-h-11 shrink-0 items-center gap-2 whitespace-nowrap px-1">
            <input
              type="checkbox"
              className="size-6 accent-accent"
              checked={p.snapToFixtures}
              onChange={(e) => p.onSnapToFixtures(e.target.checked)}
            />
            Snap to fixtures
          </label>
        </div>
      ) : null}
    </div>
  );
}
