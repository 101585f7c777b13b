import { memo } from "react";
import { FIXTURE_FAMILY, FIXTURE_FAMILY_NAMES, FIXTURE_KIND_NAMES } from "../../../../../server/contracts/fixture-kinds";
import type { Fixture } from "../../../../../server/contracts/fixtures";
import { polygonArea } from "../../../../../server/analysis/geometry/polygon-area";
import { formatLength, type LengthPreference } from "../../../../../server/domain/units/format-units";
import { fixtureBounds, fixtureCentroid } from "../../model/fixture-geometry";
import type { SystemOption } from "./properties-panel";

interface Props {
  fixtures: readonly Fixture[];
  selection: readonly string[];
  systems: readonly SystemOption[];
  preference: LengthPreference;
  onSelect: (id: string, additive: boolean) => void;
}

/** Every fixture as a row: the list view. Selecting a row selects the fixture on the plan. */
export const FixtureTable = memo(function FixtureTable({ fixtures, selection, systems, preference, onSelect }: Props) {
  const names = new Map(systems.map((s) => [s.id, s.name]));
  const selected = new Set(selection);
  const len = (m: number) => formatLength(m, preference, { decimals: 2 });
  return (
    <div className="max-h-96 overflow-auto rounded-md bg-surface edge">
      <table className="w-full border-collapse text-left text-sm">
        <caption className="sr-only">All fixtures on this plan</caption>
        <thead className="sticky top-0 bg-accent-soft">
          <tr>
            {["Label", "Kind", "Family", "System", "Fans", "Centre (x, y)", "Size"].map((h) => (
              <th key={h} scope="col" className="px-3 py-2 font-bold">
                {h}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {fixtures.map((f) => {
            const [cx, cy] = fixtureCentroid(f);
            const b = fixtureBounds(f);
            const isSel = selected.has(f.id);
            return (
              <tr key={f.id} aria-selected={isSel} className={`border-t border-line ${isSel ? "bg-note-soft font-bold" : ""}`}>
                <td className="px-3 py-1">
                  <button type="button" className="min-h-11 w-full text-left underline underline-offset-2" onClick={(e) => onSelect(f.id, e.shiftKey || e.metaKey || e.ctrlKey)}>
                    {isSel ? "▶ " : ""}
                    {f.label || <span className="text-muted">(no label)</span>}
                  </button>
                </td>
                <td className="px-3 py-1">{FIXTURE_KIND_NAMES[f.kind]}</td>
                <td className="px-3 py-1">{FIXTURE_FAMILY_NAMES[FIXTURE_FAMILY[f.kind]]}</td>
                <td className="px-3 py-1">{f.systemId ? (names.get(f.systemId) ?? "—") : "—"}</td>
                <td className="px-3 py-1">{f.hasFans ? "Yes" : "No"}</td>
                <td className="px-3 py-1 whitespace-nowrap" data-x={cx} data-y={cy}>
                  {len(cx)}, {len(cy)}
                </td>
                <td className="px-3 py-1 whitespace-nowrap">{"point" in f ? "point" : `${len(b.maxX - b.minX)} × ${len(b.maxY - b.minY)} (${Math.abs(polygonArea(f.polygon)).toFixed(1)} m²)`}</td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
});
