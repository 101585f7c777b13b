import { Button } from "../../components/ui/button";
import { useSignOut } from "../../features/auth/api/sign-out";
import { useSignOutIntent } from "./sign-out-intent";

/** The route guard sends the person to sign-in once the signed-out session arrives. */
export function SignOutButton() {
  const signOut = useSignOut();
  const intent = useSignOutIntent();
  return (
    <>
      <Button
        variant="secondary"
        busy={signOut.isPending}
        onClick={() => {
          intent.begin();
          signOut.mutate(undefined, { onError: intent.cancel });
        }}
      >
        Sign out
      </Button>
      {signOut.isError ? (
        <span role="alert" className="font-bold text-danger">
          Could not sign out: {signOut.error.message}
        </span>
      ) : null}
    </>
  );
}
