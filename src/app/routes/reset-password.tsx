import { useParams } from "react-router";
import { PasswordResetForm } from "../../features/auth/components/password-reset-form";
import { useDocumentTitle } from "../../lib/use-document-title";

export function Component() {
  useDocumentTitle("Choose a new password");
  const { token = "" } = useParams();
  return (
    <>
      <h1 className="mb-6 text-3xl font-bold">Choose a new password</h1>
      <PasswordResetForm token={token} />
    </>
  );
}
