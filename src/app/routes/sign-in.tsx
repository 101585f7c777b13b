import { Link, Navigate, useNavigate, useSearchParams } from "react-router";
import { Spinner } from "../../components/ui/spinner";
import { useSession } from "../../features/auth/api/get-session";
import { SignInForm } from "../../features/auth/components/sign-in-form";
import { useDocumentTitle } from "../../lib/use-document-title";
import { safeNext } from "../shell/safe-next";

export function Component() {
  useDocumentTitle("Sign in");
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const session = useSession();
  const next = safeNext(params.get("next"));

  if (session.isPending) return <Spinner />;
  if (session.data?.user) return <Navigate to={next} replace />;
  return (
    <>
      <h1 className="mb-2 text-3xl font-bold">Sign in</h1>
      <p className="mb-6 text-muted">Leak sweeps, findings and records for your stores.</p>
      <SignInForm onSignedIn={() => void navigate(next, { replace: true })} />
      <p className="mt-8 text-muted">
        New to Plumeline? <Link to="/sign-up">Create your company's account</Link>
      </p>
    </>
  );
}
