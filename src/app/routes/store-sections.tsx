import type { ComponentType } from "react";
import type { Store } from "#core/contracts/stores";
import type { Role } from "#core/domain/roles";
import { can } from "#core/domain/roles";
import { PlanSection } from "../../features/layout/components/plan/plan-section";
import { SystemsSection } from "../../features/systems/components/systems-section";
import { StoreSweepsSection } from "../../features/fieldmap/components/store-sweeps-section";
import { StoreRecordsSection } from "../../features/compliance/components/store-records-section";
import type { UnitPreferences } from "../shell/use-unit-preferences";
import { useSignedIn } from "../shell/session-context";

/** What every section of the store page is given; each feature reads the rest itself. */
export interface StoreSectionProps {
  store: Store;
  role: Role;
  units: UnitPreferences;
}

/**
 * The store page is this list, in order: each feature adds its own section here (sweeps,
 * findings, records) without the store page knowing its insides. Keep one line per feature.
 */
export const STORE_SECTIONS: readonly { id: string; Component: ComponentType<StoreSectionProps> }[] = [
  {
    id: "plan",
    Component: ({ store, role, units }) => (
      <PlanSection
        storeId={store.id}
        timeZone={store.timeZone}
        canEdit={can(role, "plans.edit") && !store.archivedAt}
        preference={units.length}
      />
    ),
  },
  {
    id: "systems",
    Component: function Systems({ store, role, units }) {
      const { session } = useSignedIn();
      return (
        <SystemsSection
          storeId={store.id}
          canEdit={can(role, "stores.edit") && !store.archivedAt}
          canRevise={can(role, "compliance.manage") && !store.archivedAt}
          rules={session.rules}
          massUnit={units.mass}
          numberFormat={units.number}
        />
      );
    },
  },
  {
    id: "sweeps",
    Component: ({ store, role, units }) => (
      <StoreSweepsSection
        storeId={store.id}
        timeZone={store.timeZone}
        canCompare={can(role, "sweeps.read")}
        numberFormat={units.number}
      />
    ),
  },
  {
    id: "records",
    Component: ({ store, units }) => <StoreRecordsSection storeId={store.id} numberFormat={units.number} />,
  },
];
