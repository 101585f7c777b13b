import { LOCATOR_SETTINGS, type LocatorSettings } from "#core/analysis/locator/settings";

const merge = (a: unknown, b: unknown): unknown =>
  b && typeof b === "object" && !Array.isArray(b) && a && typeof a === "object"
    ? Object.fromEntries(
        Object.entries(a as object).map(([k, v]) => [k, k in (b as object) ? merge(v, (b as never)[k]) : v]),
      )
    : (b ?? a);

/** The locator's settings with a `--settings` JSON object merged in, key by key (an experiment's). */
export function settingsWith(json: string | undefined): LocatorSettings {
  return merge(LOCATOR_SETTINGS, JSON.parse(json ?? "{}")) as LocatorSettings;
}
