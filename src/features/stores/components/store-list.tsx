import { EmptyState } from "../../../components/ui/empty-state";
import type { StoreSummary } from "../api/get-stores";

export function StoreList({ stores, scoped }: { stores: readonly StoreSummary[]; scoped: boolean }) {
  const active = stores.filter((store) => store.archivedAt === null);
  if (active.length === 0) {
    return (
      <EmptyState title="No stores yet">
        {scoped ? "No store has been shared with you in this company yet." : "This company has no stores on record yet."}
      </EmptyState>
    );
  }
  return (
    <ul className="grid gap-3 sm:grid-cols-2">
      {active.map((store) => (
        <li key={store.id} className="rounded-md bg-surface p-4 edge">
          <p className="text-lg font-bold">{store.name}</p>
          <p className="whitespace-pre-line text-muted">{store.address}</p>
        </li>
      ))}
    </ul>
  );
}
