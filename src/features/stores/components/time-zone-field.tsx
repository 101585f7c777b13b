import { useId, useMemo } from "react";
import { FieldError } from "../../../components/ui/field-error";

/** Every IANA zone the browser knows; the server checks the same list with Intl. */
function zoneList(): string[] {
  const intl = Intl as typeof Intl & { supportedValuesOf?: (key: "timeZone") => string[] };
  return intl.supportedValuesOf ? intl.supportedValuesOf("timeZone") : ["UTC"];
}

export function browserTimeZone(): string {
  return Intl.DateTimeFormat().resolvedOptions().timeZone || "UTC";
}

/**
 * A typed field with the zone list as suggestions (a datalist): four hundred options are too
 * many for a plain select, and typing "Chicago" is quicker than scrolling.
 */
export function TimeZoneField({
  value,
  onChange,
  error,
}: {
  value: string;
  onChange: (zone: string) => void;
  error?: string;
}) {
  const id = useId();
  const zones = useMemo(zoneList, []);
  const now = useMemo(() => {
    try {
      return new Intl.DateTimeFormat(undefined, {
        timeZone: value,
        hour: "2-digit",
        minute: "2-digit",
        timeZoneName: "short",
      }).format(new Date());
    } catch {
      return null;
    }
  }, [value]);
  return (
    <div>
      <label htmlFor={id} className="block font-bold">
        Time zone
      </label>
      <p id={`${id}-hint`} className="text-sm text-muted">
        Sweep and finding times are shown in the store's zone.{" "}
        {now ? `Local time there now: ${now}.` : "Type a zone such as America/Chicago."}
      </p>
      <input
        id={id}
        list={`${id}-zones`}
        value={value}
        onChange={(e) => onChange(e.target.value)}
        autoComplete="off"
        aria-invalid={error ? true : undefined}
        aria-describedby={`${id}-hint${error ? ` ${id}-error` : ""}`}
        className={`mt-1 block min-h-11 w-full rounded-md bg-surface px-3 py-2 text-ink edge ${error ? "border-danger" : ""}`}
      />
      <datalist id={`${id}-zones`}>
        {zones.map((z) => (
          <option key={z} value={z} />
        ))}
      </datalist>
      <FieldError id={`${id}-error`} label="Time zone" message={error} />
    </div>
  );
}
