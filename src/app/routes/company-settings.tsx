import { useQueryClient } from "@tanstack/react-query";
import { can } from "#core/domain/roles";
import { PageHeader } from "../../components/ui/page-header";
import { QueryError } from "../../components/ui/query-error";
import { Spinner } from "../../components/ui/spinner";
import { authKeys } from "../../features/auth/api/auth-keys";
import { ReadingsSection } from "../../features/compliance/components/readings-section";
import { useCompanySettings } from "../../features/settings/api/get-company-settings";
import { CompanySettingsForm } from "../../features/settings/components/company-settings-form";
import { CustomProfileSection } from "../../features/settings/components/custom-profile-section";
import { FailedJobsSection } from "../../features/settings/components/failed-jobs-section";
import { RecordsArchiveSection } from "../../features/settings/components/records-archive-section";
import { useDocumentTitle } from "../../lib/use-document-title";
import { useSignedIn } from "../shell/session-context";

export function Component() {
  useDocumentTitle("Company settings");
  const { membership } = useSignedIn();
  const queryClient = useQueryClient();
  const settings = useCompanySettings();
  return (
    <>
      <PageHeader
        title="Company settings"
        description="Units, the rule profile and the checks the company works under."
      />
      {settings.isPending ? <Spinner label="Loading settings…" /> : null}
      {settings.isError ? (
        <QueryError error={settings.error} what="the settings" onRetry={() => void settings.refetch()} />
      ) : null}
      {settings.data ? (
        <CompanySettingsForm
          // A fresh form per company, so a switch never shows the last company's values.
          key={membership.companyId}
          settings={settings.data}
          editable={can(membership.role, "settings.manage")}
          // The header shows the company name from the session.
          onSaved={() => void queryClient.invalidateQueries({ queryKey: authKeys.session() })}
        />
      ) : null}
      {settings.data ? (
        <CustomProfileSection
          key={`custom-${membership.companyId}`}
          editable={can(membership.role, "settings.manage")}
        />
      ) : null}
      {settings.data ? (
        <ReadingsSection key={`readings-${membership.companyId}`} canAccept={can(membership.role, "settings.manage")} />
      ) : null}
      {can(membership.role, "records.export") ? <RecordsArchiveSection /> : null}
      {/* Only owners manage the company (settings.manage): the list is theirs. */}
      {settings.data && can(membership.role, "settings.manage") ? (
        <FailedJobsSection key={`failed-jobs-${membership.companyId}`} />
      ) : null}
    </>
  );
}
