/** A zone as the picker shows it: the place, its region, its offset now, and words to find it by. */
export interface ZoneOption {
  id: string;
  place: string;
  region: string;
  /** "UTC−06:00" at `now`. */
  offset: string;
  /** "Central Time", when the runtime knows a name for it. */
  name: string;
  search: string;
}

/** Every zone the runtime knows (the server checks the same list with Intl). */
export function zoneIds(): string[] {
  const intl = Intl as typeof Intl & { supportedValuesOf?: (key: "timeZone") => string[] };
  return intl.supportedValuesOf ? intl.supportedValuesOf("timeZone") : ["UTC"];
}

function part(zone: string, now: Date, style: "longOffset" | "longGeneric"): string {
  try {
    const parts = new Intl.DateTimeFormat("en-US", { timeZone: zone, timeZoneName: style }).formatToParts(now);
    return parts.find((p) => p.type === "timeZoneName")?.value ?? "";
  } catch {
    return "";
  }
}

const fold = (s: string) =>
  s
    .normalize("NFD")
    .replace(/[\u0300-\u036f]/g, "")
    .replace(/[_/]/g, " ")
    .toLowerCase();

export function zoneOption(id: string, now: Date): ZoneOption {
  const segments = id.split("/");
  const place = segments[segments.length - 1].replace(/_/g, " ");
  const region = segments.slice(0, -1).join(" / ").replace(/_/g, " ");
  const gmt = part(id, now, "longOffset"); // "GMT-06:00", or "GMT" at zero offset
  const offset = gmt === "GMT" || gmt === "" ? "UTC±00:00" : gmt.replace("GMT", "UTC").replace("-", "−");
  const generic = part(id, now, "longGeneric");
  const name = /^GMT/.test(generic) ? "" : generic;
  return { id, place, region, offset, name, search: fold(`${id} ${name} ${offset} ${offset.replace("−", "-")}`) };
}

/** Zones whose id, name or offset hold every word of the query ("new york", "central", "+01"). */
export function searchZones(options: readonly ZoneOption[], query: string, limit = 40): ZoneOption[] {
  const words = fold(query).split(/\s+/).filter(Boolean);
  if (words.length === 0) return options.slice(0, limit);
  const hits = options.filter((o) => words.every((w) => o.search.includes(w)));
  // Places that start with the query first: "paris" before "America/Paramaribo".
  const starts = (o: ZoneOption) => (fold(o.place).startsWith(words.join(" ")) ? 0 : 1);
  return hits.sort((a, b) => starts(a) - starts(b)).slice(0, limit);
}
