import { useNavigate } from "react-router";
import { Button } from "../../components/ui/button";
import { useSignOut } from "../../features/auth/api/sign-out";

export function SignOutButton() {
  const signOut = useSignOut();
  const navigate = useNavigate();
  return (
    <Button variant="secondary" busy={signOut.isPending} onClick={() => signOut.mutate(undefined, { onSuccess: () => void navigate("/sign-in", { replace: true }) })}>
      Sign out
    </Button>
  );
}
