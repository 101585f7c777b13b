import { useParams } from "react-router";
import { WalkScreen } from "../../features/walk/components/walk-screen";
import { useDocumentTitle } from "../../lib/use-document-title";
import { ContrastToggle } from "../shell/contrast-toggle";
import { useUnitPreferences } from "../shell/use-unit-preferences";
import { useSignedIn } from "../shell/session-context";

export const handle = { fullScreen: true };

export function Component() {
  useDocumentTitle("Walk");
  const { storeId, sweepId } = useParams();
  const units = useUnitPreferences();
  const { session } = useSignedIn();
  return (
    <WalkScreen
      storeId={storeId!}
      sweepId={sweepId!}
      contrastToggle={<ContrastToggle />}
      leaveTo={`/stores/${storeId}/walk`}
      lengthUnit={units.length}
      numberFormat={units.number}
      cautionRules={session.rules}
    />
  );
}
