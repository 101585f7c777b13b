import { useId, useMemo, useState, type KeyboardEvent } from "react";
import { FieldError } from "../../../components/ui/field-error";
import { searchZones, zoneIds, zoneOption, type ZoneOption } from "../model/time-zones";

export function browserTimeZone(): string {
  return Intl.DateTimeFormat().resolvedOptions().timeZone || "UTC";
}

function localTime(zone: string): string | null {
  try {
    return new Intl.DateTimeFormat(undefined, { timeZone: zone, hour: "2-digit", minute: "2-digit" }).format(
      new Date(),
    );
  } catch {
    return null;
  }
}

const label = (o: ZoneOption) => `${o.place}${o.region ? `, ${o.region}` : ""}`;

/**
 * A searchable time-zone picker (the ARIA combobox pattern): type a city, a zone name such as
 * "Central" or an offset such as "+01", then pick from the list. The stored value stays the zone id.
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
  const options = useMemo(() => zoneIds().map((z) => zoneOption(z, new Date())), []);
  const selected = options.find((o) => o.id === value);
  const [query, setQuery] = useState<string | null>(null); // null: show the chosen zone, not a search
  const [active, setActive] = useState(0);
  const open = query !== null;
  const hits = useMemo(() => (open ? searchZones(options, query) : []), [open, options, query]);
  const now = selected ? localTime(selected.id) : null;

  const choose = (o: ZoneOption) => {
    onChange(o.id);
    setQuery(null);
  };
  const onKey = (e: KeyboardEvent<HTMLInputElement>) => {
    if (e.key === "ArrowDown" || e.key === "ArrowUp") {
      e.preventDefault();
      if (!open) setQuery("");
      const step = e.key === "ArrowDown" ? 1 : -1;
      setActive((a) => Math.max(0, Math.min(hits.length - 1, a + step)));
    } else if (e.key === "Enter" && open && hits[active]) {
      e.preventDefault();
      choose(hits[active]);
    } else if (e.key === "Escape") {
      setQuery(null);
    }
  };

  return (
    <div className="relative">
      <label htmlFor={id} className="block font-bold">
        Time zone
      </label>
      <p id={`${id}-hint`} className="text-sm text-muted">
        Sweep and finding times are shown in the store's zone. Type a city, a zone name or an offset.
        {selected && now ? ` Local time there now: ${now} (${selected.offset}).` : ""}
      </p>
      <input
        id={id}
        role="combobox"
        aria-expanded={open}
        aria-controls={`${id}-list`}
        aria-autocomplete="list"
        aria-activedescendant={open && hits[active] ? `${id}-opt-${active}` : undefined}
        value={open ? query : selected ? label(selected) : value}
        onChange={(e) => {
          setQuery(e.target.value);
          setActive(0);
        }}
        onFocus={(e) => e.target.select()}
        onBlur={() => setQuery(null)}
        onKeyDown={onKey}
        autoComplete="off"
        spellCheck={false}
        aria-invalid={error ? true : undefined}
        aria-describedby={`${id}-hint${error ? ` ${id}-error` : ""}`}
        className={`mt-1 block min-h-11 w-full rounded-md bg-surface px-3 py-2 text-ink edge ${error ? "border-danger" : ""}`}
      />
      {open ? (
        <ul
          id={`${id}-list`}
          role="listbox"
          aria-label="Time zones"
          className="absolute z-20 mt-1 max-h-72 w-full overflow-auto rounded-md bg-surface shadow-lg edge"
        >
          {hits.length === 0 ? <li className="px-3 py-2 text-muted">No zone matches “{query}”.</li> : null}
          {hits.map((o, i) => (
            <li
              key={o.id}
              id={`${id}-opt-${i}`}
              role="option"
              aria-selected={i === active}
              // mousedown, not click: the input's blur would close the list before a click lands
              onMouseDown={(e) => {
                e.preventDefault();
                choose(o);
              }}
              className={`flex min-h-11 cursor-pointer flex-wrap items-center justify-between gap-x-3 px-3 py-1 ${i === active ? "bg-accent-soft" : ""}`}
            >
              <span className="font-bold">{label(o)}</span>
              <span className="text-sm text-muted">{[o.name, o.offset].filter(Boolean).join(" · ")}</span>
            </li>
          ))}
        </ul>
      ) : null}
      <FieldError id={`${id}-error`} label="Time zone" message={error} />
    </div>
  );
}
