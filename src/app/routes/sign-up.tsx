import { Navigate } from "react-router";
import { Spinner } from "../../components/ui/spinner";
import { useSession } from "../../features/auth/api/get-session";
import { SignUpForm } from "../../features/auth/components/sign-up-form";
import { useDocumentTitle } from "../../lib/use-document-title";

export function Component() {
  useDocumentTitle("Create your company's account");
  const session = useSession();
  if (session.isPending) return <Spinner />;
  if (session.data?.user) return <Navigate to="/" replace />;
  return (
    <>
      <h1 className="mb-2 text-3xl font-bold">Create your company's account</h1>
      <p className="mb-6 text-muted">
        For refrigeration service companies and store chains' refrigeration teams. You become its owner and can invite
        your team afterwards.
      </p>
      <SignUpForm />
    </>
  );
}
