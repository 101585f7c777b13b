import { describe, expect, it } from "vitest";
import { REFRIGERANTS } from "../refrigerants/catalogue";
import { readableSource } from "./citations";
import { EU_FGAS_PROFILE } from "./eu-fgas-profile";
import { profileReadings } from "./readings";
import { US_FEDERAL_PROFILE } from "./us-federal-profile";

describe("readings and research notes (docs/decisions/0044-readings-and-research-notes.md)", () => {
  it("shows a neutral 'reading' marker, never 'from memory', a study guide or a magazine", () => {
    // docs/reference/standards.md §1: follow-up verification within 10 days is [M].
    expect(readableSource("[M] 40 CFR 84.106: follow-up verification within 10 days; definition [S:R8]")).toBe(
      "40 CFR 84.106: follow-up verification within 10 days (reading); definition: 40 CFR 82.152",
    );
    // R6 is a trade magazine's summary and R7 a study guide: a reader sees the rule they summarise, once
    // (R7's "82 subpart F and 84 subpart C" already says R6's "82 subpart F").
    expect(readableSource("[S:R6,R7] records kept 3 years")).toBe(
      "records kept 3 years (40 CFR 82 subpart F and 84 subpart C)",
    );
    const all = [US_FEDERAL_PROFILE, EU_FGAS_PROFILE].flatMap((p) =>
      JSON.stringify(p)
        .match(/"source":"[^"]*"/g)!
        .map((s) => readableSource(JSON.parse(`{${s}}`).source)),
    );
    const catalogue = REFRIGERANTS.flatMap((r) => [
      r.safetyClass.source,
      ...(r.kind === "blend" ? [r.compositionSource] : Object.values(r.gwp).map((g) => g!.source)),
    ]).map(readableSource);
    for (const text of [...all, ...catalogue]) {
      expect(text).not.toMatch(/from memory|study guide|ACHR|magazine|Legal Register|not yet confirmed/i);
    }
  });

  it("lists every reading of a profile once, in plain words, with the product's own readings first", () => {
    const us = profileReadings(US_FEDERAL_PROFILE);
    expect(us[0].text).toMatch(/first leak rate above the threshold/);
    const values = us.filter((r) => r.kind === "profile-value").map((r) => r.text);
    expect(values).toContain("40 CFR 84.106: follow-up verification within 10 days; definition: 40 CFR 82.152");
    expect(new Set(values).size).toBe(values.length);
    for (const v of values) expect(v).not.toMatch(/\breading\b|\[M\]/);
    // The EU profile's values from memory include the HFO leak-check intervals (docs/reference/standards.md §2 [M]).
    expect(profileReadings(EU_FGAS_PROFILE).some((r) => /HFOs/.test(r.text))).toBe(true);
  });
});
