import { can } from "#core/domain/roles";
import { PageHeader } from "../../components/ui/page-header";
import { QueryError } from "../../components/ui/query-error";
import { Spinner } from "../../components/ui/spinner";
import { useStores } from "../../entities/stores/stores-api";
import { useTeam } from "../../features/team/api/get-team";
import { InvitationsList } from "../../features/team/components/invitations-list";
import { InviteForm } from "../../features/team/components/invite-form";
import { MembersTable } from "../../features/team/components/members-table";
import { SecurityLogList } from "../../features/account/components/security-log-list";
import { useDocumentTitle } from "../../lib/use-document-title";
import { useSignedIn } from "../shell/session-context";
import { Component as NotFound } from "./not-found";

export function Component() {
  useDocumentTitle("Team");
  const { session, user, membership } = useSignedIn();
  const allowed = can(membership.role, "members.read");
  const canManage = can(membership.role, "members.manage");
  const team = useTeam({ enabled: allowed });
  // Store names for the store contacts' column and the store picker: the stores feature meets team here.
  const stores = useStores({}, { enabled: allowed });

  if (!allowed) return <NotFound />;
  return (
    <>
      <PageHeader
        title="Team"
        description={`Everyone who works in ${membership.companyName} on Plumeline, and their roles.`}
      />
      {team.isPending ? <Spinner label="Loading the team…" /> : null}
      {team.isError ? <QueryError error={team.error} what="the team" onRetry={() => void team.refetch()} /> : null}
      {team.data ? (
        <div className="space-y-8">
          <section aria-labelledby="members-heading" className="space-y-3">
            <h2 id="members-heading" className="text-xl font-bold">
              Members
            </h2>
            <MembersTable
              members={team.data.members}
              stores={stores.data}
              canManage={canManage}
              currentUserId={user.id}
              companyName={membership.companyName}
            />
          </section>
          <section aria-labelledby="invitations-heading" className="space-y-3">
            <h2 id="invitations-heading" className="text-xl font-bold">
              Pending invitations
            </h2>
            <InvitationsList invitations={team.data.invitations} stores={stores.data} canManage={canManage} />
          </section>
          {canManage ? (
            <InviteForm stores={stores.data} storesLoading={stores.isPending} outboxHint={session.outboxEnabled} />
          ) : null}
          {canManage ? (
            <section aria-labelledby="security-heading" className="space-y-3">
              <h2 id="security-heading" className="text-xl font-bold">
                Security log
              </h2>
              <p className="max-w-prose text-muted">
                Sign-ins, failed sign-ins, password and role changes, removals and downloads of records, for everyone in{" "}
                {membership.companyName}. Times are in your own time zone.
              </p>
              <SecurityLogList />
            </section>
          ) : null}
        </div>
      ) : null}
    </>
  );
}
