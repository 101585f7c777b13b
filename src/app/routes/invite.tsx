import { Link, useNavigate, useParams } from "react-router";
import { Alert } from "../../components/ui/alert";
import { Spinner } from "../../components/ui/spinner";
import { useInvitation } from "../../features/auth/api/get-invitation";
import { AcceptInvitationForm } from "../../features/auth/components/accept-invitation-form";
import { isApiRequestError } from "../../lib/api-client";
import { useDocumentTitle } from "../../lib/use-document-title";

export function Component() {
  useDocumentTitle("Invitation");
  const { token = "" } = useParams();
  const navigate = useNavigate();
  const invitation = useInvitation(token);

  if (invitation.isPending) return <Spinner label="Reading the invitation…" />;
  if (invitation.isError) {
    const gone = isApiRequestError(invitation.error) && invitation.error.status === 404;
    return (
      <>
        <h1 className="mb-6 text-3xl font-bold">Invitation</h1>
        <Alert tone="error" title={gone ? "This invitation cannot be used" : "Could not read the invitation"}>
          <p>
            {gone
              ? "It may have been used already, revoked or have expired. Ask the person who invited you to send a new one."
              : isApiRequestError(invitation.error)
                ? invitation.error.message
                : "Please try again."}
          </p>
          <p className="mt-2">
            <Link to="/sign-in">Go to sign in</Link>
          </p>
        </Alert>
      </>
    );
  }
  return (
    <>
      <h1 className="mb-6 text-3xl font-bold">Join {invitation.data.companyName}</h1>
      <AcceptInvitationForm
        token={token}
        preview={invitation.data}
        onAccepted={() => void navigate("/", { replace: true })}
      />
    </>
  );
}
