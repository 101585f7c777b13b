import { memo, useMemo, useState } from "react";
import { FIXTURE_FAMILY_NAMES } from "#core/contracts/fixture-kinds";
import { formatLength, type LengthPreference } from "#core/domain/units/format-units";
import { fixtureRows, type RowKey } from "../../model/fixture-table";
import type { Scene } from "../../model/scene";
import type { SystemOption } from "./properties-panel";

interface Props {
  scene: Scene;
  systems: readonly SystemOption[];
  preference: LengthPreference;
  onSelect: (id: string, additive: boolean) => void;
}

const COLUMNS: { header: string; key: RowKey | null }[] = [
  { header: "Label", key: "label" },
  { header: "Kind", key: "kindName" },
  { header: "Family", key: "family" },
  { header: "System", key: null },
  { header: "Fans", key: null },
  { header: "Centre (x, y)", key: "x" },
  { header: "Size", key: "areaM2" },
];

/** Every fixture as a row (the list view), sortable by its headers; a row's button selects the fixture. */
export const FixtureTable = memo(function FixtureTable({ scene, systems, preference, onSelect }: Props) {
  const [sort, setSort] = useState<{ key: RowKey; descending: boolean } | null>(null);
  // Rows depend on the fixtures and order only: a selection change does not recompute them.
  const rows = useMemo(
    () => fixtureRows({ ...scene, selection: [] }, sort?.key ?? null, sort?.descending ?? false),
    [scene.fixtures, scene.order, sort],
  ); // eslint-disable-line react-hooks/exhaustive-deps
  const names = new Map(systems.map((s) => [s.id, s.name]));
  const selected = new Set(scene.selection);
  const len = (m: number) => formatLength(m, preference, { decimals: 2 });
  // 1 ft² = 0.09290304 m² exactly (0.3048² m², NIST SP 811).
  const area = (m2: number) => (preference === "ft-in" ? `${(m2 / 0.09290304).toFixed(1)} ft²` : `${m2.toFixed(1)} m²`);
  return (
    <div className="max-h-96 overflow-auto rounded-md bg-surface edge">
      <table className="w-full border-collapse text-left text-sm">
        <caption className="sr-only">All fixtures on this plan</caption>
        <thead className="sticky top-0 bg-accent-soft">
          <tr>
            {COLUMNS.map(({ header, key }) => {
              const active = key !== null && sort?.key === key;
              return (
                <th
                  key={header}
                  scope="col"
                  className="px-3 py-1 font-bold"
                  aria-sort={active ? (sort!.descending ? "descending" : "ascending") : undefined}
                >
                  {key ? (
                    <button
                      type="button"
                      className="min-h-11 font-bold"
                      onClick={() =>
                        setSort(
                          active ? (sort!.descending ? null : { key, descending: true }) : { key, descending: false },
                        )
                      }
                    >
                      {header} {active ? (sort!.descending ? "▼" : "▲") : ""}
                    </button>
                  ) : (
                    header
                  )}
                </th>
              );
            })}
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => {
            const isSel = selected.has(r.id);
            return (
              <tr
                key={r.id}
                aria-selected={isSel}
                className={`border-t border-line ${isSel ? "bg-note-soft font-bold" : ""}`}
              >
                <td className="px-3 py-1">
                  <button
                    type="button"
                    className="min-h-11 w-full text-left underline underline-offset-2"
                    onClick={(e) => onSelect(r.id, e.shiftKey || e.metaKey || e.ctrlKey)}
                  >
                    {isSel ? "▶ " : ""}
                    {r.label || <span className="text-muted">(no label)</span>}
                  </button>
                </td>
                <td className="px-3 py-1">{r.kindName}</td>
                <td className="px-3 py-1">{FIXTURE_FAMILY_NAMES[r.family]}</td>
                <td className="px-3 py-1">{r.systemId ? (names.get(r.systemId) ?? "—") : "—"}</td>
                <td className="px-3 py-1">{r.hasFans ? "Yes" : "No"}</td>
                <td className="whitespace-nowrap px-3 py-1" data-x={r.x} data-y={r.y}>
                  {len(r.x)}, {len(r.y)}
                </td>
                <td className="whitespace-nowrap px-3 py-1">
                  {r.widthM === null ? "point" : `${len(r.widthM)} × ${len(r.depthM!)} (${area(Math.abs(r.areaM2!))})`}
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
});
