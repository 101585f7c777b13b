import { Navigate, useLocation } from "react-router";
import { isStoreScoped, type Role } from "../../../server/domain/roles";
import { PageHeader } from "../../components/ui/page-header";
import { QueryError } from "../../components/ui/query-error";
import { Spinner } from "../../components/ui/spinner";
import { useStores } from "../../features/stores/api/get-stores";
import { StoreList } from "../../features/stores/components/store-list";
import { useDocumentTitle } from "../../lib/use-document-title";
import { useSignedIn } from "../shell/session-context";

// Owners, engineers and lead techs answer for the books: they land on Today.
const LANDS_ON_TODAY: readonly Role[] = ["owner", "engineer", "lead-tech"];

export function Component() {
  const { pathname } = useLocation();
  const { membership } = useSignedIn();
  if (pathname === "/" && LANDS_ON_TODAY.includes(membership.role)) return <Navigate to="/today" replace />;
  return <Stores />;
}

function Stores() {
  useDocumentTitle("Stores");
  const { membership } = useSignedIn();
  const stores = useStores();
  const scoped = isStoreScoped(membership.role);
  return (
    <>
      <PageHeader title="Stores" description={scoped ? "The stores shared with you." : `The stores of ${membership.companyName}.`} />
      {stores.isPending ? <Spinner label="Loading stores…" /> : null}
      {stores.isError ? <QueryError error={stores.error} what="the stores" onRetry={() => void stores.refetch()} /> : null}
      {stores.data ? <StoreList stores={stores.data} scoped={scoped} /> : null}
    </>
  );
}
