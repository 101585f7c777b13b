import { useMemo, type ReactNode } from "react";
import { AcceptedReadingsContext } from "../../../components/ui/source-text";
import { useReadings } from "../api/get-readings";

/**
 * Lets every "reading" marker below say whether the owner has accepted the reading behind it; a
 * withdrawal shows at once as "not accepted" (docs/decisions/0048-accepting-readings.md). Until the
 * list is read, markers stay plain.
 */
export function AcceptedReadings({ children }: { children: ReactNode }) {
  const readings = useReadings();
  const accepted = useMemo(
    () => (readings.data ? new Set(readings.data.readings.filter((r) => r.accepted).map((r) => r.text)) : null),
    [readings.data],
  );
  return <AcceptedReadingsContext.Provider value={accepted}>{children}</AcceptedReadingsContext.Provider>;
}
