import { useState } from "react";
import { Navigate, useLocation, useNavigate, useSearchParams } from "react-router";
import { can, isStoreScoped, type Role } from "#core/domain/roles";
import { Button } from "../../components/ui/button";
import { PageHeader } from "../../components/ui/page-header";
import { StoreForm } from "../../features/stores/components/store-form";
import { StoreTable } from "../../features/stores/components/store-table";
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
  const navigate = useNavigate();
  const scoped = isStoreScoped(membership.role);
  const canEdit = can(membership.role, "stores.edit");
  // "/stores?new=1" (the welcome screen's first step) opens the new-store form at once.
  const [params] = useSearchParams();
  const [creating, setCreating] = useState(canEdit && params.get("new") === "1");
  return (
    <>
      <PageHeader
        title="Stores"
        description={scoped ? "The stores shared with you." : `The stores of ${membership.companyName}.`}
        actions={canEdit && !creating ? <Button onClick={() => setCreating(true)}>New store</Button> : null}
      />
      {creating ? (
        <div className="mb-6 max-w-xl">
          <StoreForm onDone={(s) => navigate(`/stores/${s.id}`)} onCancel={() => setCreating(false)} />
        </div>
      ) : null}
      <StoreTable scoped={scoped} />
    </>
  );
}
