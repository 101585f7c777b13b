import { useQueryClient } from "@tanstack/react-query";
import { PageHeader } from "../../components/ui/page-header";
import { updateSession } from "../../features/auth/api/session-cache";
import { useCompanySettings } from "../../features/settings/api/get-company-settings";
import { ProfileForm } from "../../features/settings/components/profile-form";
import { useDocumentTitle } from "../../lib/use-document-title";
import { useSignedIn } from "../shell/session-context";

export function Component() {
  useDocumentTitle("Profile");
  const { user } = useSignedIn();
  const queryClient = useQueryClient();
  const settings = useCompanySettings();
  return (
    <>
      <PageHeader
        title="Profile"
        description="Your name, and the units you want figures shown in. Your choice overrides the company default for you only."
      />
      <ProfileForm user={user} companyDefaults={settings.data} onSaved={(info) => updateSession(queryClient, info)} />
    </>
  );
}
