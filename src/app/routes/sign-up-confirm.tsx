import { useEffect, useRef } from "react";
import { Link, useNavigate, useParams } from "react-router";
import { Alert } from "../../components/ui/alert";
import { Spinner } from "../../components/ui/spinner";
import { useConfirmSignUp } from "../../features/auth/api/sign-up";
import { formErrorMessage } from "../../lib/form-errors";
import { useDocumentTitle } from "../../lib/use-document-title";

export function Component() {
  useDocumentTitle("Confirm your e-mail");
  const { token = "" } = useParams();
  const navigate = useNavigate();
  const confirm = useConfirmSignUp();
  const sent = useRef(false);
  useEffect(() => {
    if (sent.current) return; // once, also under React's double effects in development
    sent.current = true;
    confirm.mutate(token, { onSuccess: () => void navigate("/welcome", { replace: true }) });
  }, [confirm, navigate, token]);
  if (confirm.isError)
    return (
      <Alert tone="error" title="This link cannot open a company">
        <p>{formErrorMessage(confirm.error)}</p>
        <p className="mt-2">
          <Link to="/sign-up">Sign up again</Link> or <Link to="/sign-in">sign in</Link>.
        </p>
      </Alert>
    );
  return <Spinner label="Opening your company…" />;
}
