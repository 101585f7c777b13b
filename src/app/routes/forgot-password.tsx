import { Link } from "react-router";
import { PasswordResetRequestForm } from "../../features/auth/components/password-reset-request-form";
import { useDocumentTitle } from "../../lib/use-document-title";

export function Component() {
  useDocumentTitle("Forgot password");
  return (
    <>
      <h1 className="mb-2 text-3xl font-bold">Forgot password</h1>
      <p className="mb-6 text-muted">Enter the e-mail you sign in with. We send a link to choose a new password.</p>
      <PasswordResetRequestForm />
      <p className="mt-6">
        <Link to="/sign-in">Back to sign in</Link>
      </p>
    </>
  );
}
