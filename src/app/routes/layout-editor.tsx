import { useQuery } from "@tanstack/react-query";
import { Link, useParams } from "react-router";
import { can } from "#core/domain/roles";
import { Alert } from "../../components/ui/alert";
import { PageHeader } from "../../components/ui/page-header";
import { QueryError } from "../../components/ui/query-error";
import { Spinner } from "../../components/ui/spinner";
import { planFixturesQueryOptions, usePlan } from "../../entities/plans/plans-api";
import { useStore } from "../../entities/stores/stores-api";
import { useSystems } from "../../entities/systems/systems-api";
import { LayoutEditor } from "../../features/layout/components/editor/layout-editor";
import { useDocumentTitle } from "../../lib/use-document-title";
import { useSignedIn } from "../shell/session-context";
import { useUnitPreferences } from "../shell/use-unit-preferences";

// The route is where features meet: the store's name, its systems (for the fixtures' system
// links) and the layout editor.
export function Component() {
  const { storeId = "", planId = "" } = useParams();
  const { membership } = useSignedIn();
  const units = useUnitPreferences();
  const store = useStore(storeId);
  const plan = usePlan(planId);
  // The editor owns the fixtures while it is open: no background refetch replaces a draft.
  const fixtures = useQuery({ ...planFixturesQueryOptions(planId), staleTime: Infinity });
  const systems = useSystems(storeId);
  useDocumentTitle(store.data ? `Layout · ${store.data.name}` : "Layout editor");

  const back = (
    <Link to={`/stores/${storeId}`} className="inline-flex min-h-11 items-center">
      ← {store.data?.name ?? "The store"}
    </Link>
  );
  if (plan.isError) return <QueryError error={plan.error} what="the plan" onRetry={() => void plan.refetch()} />;
  if (fixtures.isError)
    return <QueryError error={fixtures.error} what="the fixtures" onRetry={() => void fixtures.refetch()} />;
  if (plan.isPending || fixtures.isPending || systems.isPending) return <Spinner label="Opening the layout editor…" />;
  const p = plan.data;
  if (!fixtures.data.bounds) {
    return (
      <>
        {back}
        <Alert tone="note" title="Set the scale first">
          Fixtures are stored in metres, so the drawing needs its scale before anything can be drawn on it. Set it on
          the store page.
        </Alert>
      </>
    );
  }
  const canEdit = can(membership.role, "plans.edit") && !store.data?.archivedAt;
  return (
    <>
      <p className="mb-1">{back}</p>
      <PageHeader
        title={`Layout · ${store.data?.name ?? ""}`}
        description={`Plan version ${p.version}. Everything is saved in metres as you go.`}
      />
      <LayoutEditor
        key={`${p.id}`}
        plan={p}
        initial={fixtures.data}
        systems={(systems.data ?? []).map((s) => ({ id: s.id, name: s.name }))}
        preference={units.length}
        canEdit={canEdit}
      />
    </>
  );
}
