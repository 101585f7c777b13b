import type { IsoDate } from "../dates/calendar-date";

/** A charge-added record. Dates are calendar dates in the store's time zone. */
export interface ChargeAddition {
  id: string;
  date: IsoDate;
  amountKg: number;
  /** Voided by a correcting entry: ignored everywhere (it stays in the audit trail, not in the figures). */
  voided?: boolean;
  /** No leak-rate calculation at this addition (40 CFR 82.157: after a retrofit, new install or seasonal variance [S:R1]). */
  excluded?: "retrofit" | "new-installation" | "seasonal-variance";
  /** The leak (finding) the refrigerant was added for, if the technician named one. */
  findingId?: string | null;
}
