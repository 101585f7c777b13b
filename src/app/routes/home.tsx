import { isStoreScoped } from "../../../server/domain/roles";
import { PageHeader } from "../../components/ui/page-header";
import { QueryError } from "../../components/ui/query-error";
import { Spinner } from "../../components/ui/spinner";
import { useStores } from "../../features/stores/api/get-stores";
import { StoreList } from "../../features/stores/components/store-list";
import { useDocumentTitle } from "../../lib/use-document-title";
import { useSignedIn } from "../shell/session-context";

export function Component() {
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
