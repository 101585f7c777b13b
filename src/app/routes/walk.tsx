import { useParams } from "react-router";
import { WalkScreen } from "../../features/walk/components/walk-screen";
import { useDocumentTitle } from "../../lib/use-document-title";
import { ContrastToggle } from "../shell/contrast-toggle";
import { useUnitPreferences } from "../shell/use-unit-preferences";

export const handle = { fullScreen: true };

export function Component() {
  useDocumentTitle("Walk");
  const { storeId, sweepId } = useParams();
  const units = useUnitPreferences();
  return (
    <WalkScreen
      storeId={storeId!}
      sweepId={sweepId!}
      contrastToggle={<ContrastToggle />}
      leaveTo={`/stores/${storeId}/walk`}
      lengthUnit={units.length}
      numberFormat={units.number}
    />
  );
}
