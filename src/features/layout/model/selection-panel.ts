/**
 * What the side panel shows for the selection: each editable property with its shared value,
 * or "mixed" when the selected fixtures differ, and only the properties every selected
 * fixture's kind has (a door count appears for glass-door cases only, and so on).
 */
import { FIXTURE_KIND_NAMES } from "#core/contracts/fixture-kinds";
import type { Fixture, RoomDoor } from "#core/contracts/fixtures";
import { selectedFixtures, type Scene } from "./scene";

export const MIXED = Symbol("mixed");
export type Shared<T> = T | typeof MIXED;

/** Present only when every selected fixture has the field; labels only for a single selection. */
export interface PanelFields {
  label?: string;
  systemId?: Shared<string | null>;
  hasFans?: Shared<boolean>;
  doorCount?: Shared<number>;
  door?: Shared<RoomDoor | null>;
  note?: Shared<string>;
  typicalPpm?: Shared<number | null>;
}

export type PanelField = keyof PanelFields;

export interface SelectionPanel {
  count: number;
  /** "Open case", "2 × Open case", or "3 fixtures" for a mixed selection. */
  title: string;
  fields: PanelFields;
}

const FIELDS: readonly PanelField[] = ["label", "systemId", "hasFans", "doorCount", "door", "note", "typicalPpm"];

function shared(fixtures: readonly Fixture[], field: PanelField): Shared<unknown> {
  const values = fixtures.map((f) => (f as unknown as Record<string, unknown>)[field]);
  const first = JSON.stringify(values[0]);
  return values.every((v) => JSON.stringify(v) === first) ? values[0] : MIXED;
}

export function selectionPanel(scene: Scene): SelectionPanel | null {
  const fixtures = selectedFixtures(scene);
  if (fixtures.length === 0) return null;
  const kinds = new Set(fixtures.map((f) => f.kind));
  const title =
    kinds.size === 1 && fixtures.length === 1
      ? FIXTURE_KIND_NAMES[fixtures[0].kind]
      : kinds.size === 1
        ? `${fixtures.length} × ${FIXTURE_KIND_NAMES[fixtures[0].kind]}`
        : `${fixtures.length} fixtures`;
  const fields: Record<string, unknown> = {};
  for (const field of FIELDS) {
    if (field === "label" && fixtures.length > 1) continue; // labels are edited one at a time
    if (fixtures.every((f) => field in f)) fields[field] = shared(fixtures, field);
  }
  return { count: fixtures.length, title, fields: fields as PanelFields };
}
