import { useQueryClient } from "@tanstack/react-query";
import { PageHeader } from "../../components/ui/page-header";
import { PasswordChangeForm } from "../../features/account/components/password-change-form";
import { SessionsList } from "../../features/account/components/sessions-list";
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
        description="Your name, the units you want figures shown in, your password and where you are signed in."
      />
      <ProfileForm user={user} companyDefaults={settings.data} onSaved={(info) => updateSession(queryClient, info)} />
      <section aria-labelledby="password-heading" className="mt-10 space-y-3">
        <h2 id="password-heading" className="text-xl font-bold">
          Password
        </h2>
        <PasswordChangeForm />
      </section>
      <section aria-labelledby="sessions-heading" className="mt-10 space-y-3">
        <h2 id="sessions-heading" className="text-xl font-bold">
          Where you are signed in
        </h2>
        <SessionsList />
      </section>
    </>
  );
}
