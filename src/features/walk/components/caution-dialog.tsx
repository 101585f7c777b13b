import type { RefrigerantSummary } from "#core/contracts/systems";
import { refrigerantOfSummary } from "#core/domain/refrigerants/company-refrigerant";
import { roomCautions, type CautionPlace, type CautionRules } from "#core/domain/safety/cautions";
import { Button } from "../../../components/ui/button";
import { Dialog } from "../../../components/ui/dialog";

/**
 * Shown on entering a walk-in or machine room: the cautions for the refrigerants of the systems in
 * it (ammonia, CO2, flammable, where a leak collects), deferring to local codes.
 */
export function CautionDialog({
  place,
  name,
  refrigerants: summaries = [],
  rules = "us",
  onClose,
}: {
  place: CautionPlace | null;
  name: string;
  /** The refrigerants of the room's systems, as the store pack holds them (a company's own ones too). */
  refrigerants?: readonly RefrigerantSummary[];
  /** Whose rules the cautions name: an EU company reads no US rule. */
  rules?: CautionRules;
  onClose(): void;
}) {
  const refrigerants = summaries.map(refrigerantOfSummary);
  const cautions = place ? roomCautions(place, refrigerants, rules) : [];
  return (
    <Dialog
      title={`Before you enter ${name || (place === "machine-room" ? "the machine room" : "the walk-in")}`}
      open={place !== null}
      onClose={onClose}
    >
      <ul className="flex flex-col gap-2">
        {cautions.map((c) => (
          <li
            key={c.id}
            className={`rounded-md border-l-4 p-3 edge ${c.level === "warning" ? "border-danger bg-danger-soft" : "border-note bg-note-soft"}`}
          >
            {c.text}
          </li>
        ))}
        <li className="rounded-md border-l-4 border-note bg-note-soft p-3 edge">
          Site rules apply as well: follow the store's procedure for entering refrigerated rooms.
        </li>
      </ul>
      <Button onClick={onClose} className="min-h-12">
        I have checked the room's alarm — continue
      </Button>
    </Dialog>
  );
}
