import { describe, expect, it } from "vitest";
import { CITATIONS, readableSource, withReadableSources } from "./citations";
import { EU_FGAS_PROFILE } from "./eu-fgas-profile";
import { US_FEDERAL_PROFILE } from "./us-federal-profile";

const sources = (node: unknown): string[] =>
  node && typeof node === "object"
    ? Object.entries(node).flatMap(([k, v]) => (k === "source" && typeof v === "string" ? [v] : sources(v)))
    : [];

describe("readable citations", () => {
  it("turn tags into the rule they cite", () => {
    // docs/reference/standards.md Sources: R1 is 40 CFR 82.157(a)–(c); R4 summarises the 40 CFR 84 subpart C final rule.
    expect(readableSource("[S:R1] 40 CFR 82.157(c); [S:R4] 84.106")).toBe("40 CFR 82.157(c); 40 CFR 84.106");
    expect(readableSource("[S:R4] full charge ≥ 15 lb")).toBe("full charge ≥ 15 lb (40 CFR 84 subpart C)");
    // A title that already names the part is not repeated.
    expect(
      readableSource(
        "40 CFR 84 subpart C (HFCs and substitutes, GWP > 53); [S:R4] repair within 30 days of learning of the breach",
      ),
    ).toBe("40 CFR 84 subpart C (HFCs and substitutes, GWP > 53); repair within 30 days of learning of the breach");
    // The US record-keeping rule is in 40 CFR 82 subpart F and 84 subpart C (standards.md §1 [S:R6,R7]): cited once.
    expect(readableSource("[S:R6,R7]")).toBe("40 CFR 82 subpart F and 84 subpart C");
    expect(readableSource("[S:E8b] 2024/573 Art. 7, records at least 5 years")).toBe(
      "2024/573 Art. 7, records at least 5 years",
    );
    expect(readableSource("[S:E1] hermetically sealed, labelled, < 10 t CO2e")).toBe(
      "hermetically sealed, labelled, < 10 t CO2e (Regulation (EU) No 517/2014, Art. 4)",
    );
  });
  it("mark what is a reading or derived, and leave a company's own words alone", () => {
    expect(readableSource("[M] the first calculation after 1 Jan 2026 uses 365 days")).toBe(
      "the first calculation after 1 Jan 2026 uses 365 days (reading)",
    );
    expect(readableSource("[D] 10 lb into 100 lb after 180 days")).toBe(
      "10 lb into 100 lb after 180 days (derived from the cited values)",
    );
    expect(readableSource("company policy: repair within 14 days")).toBe("company policy: repair within 14 days");
    // Pointers into our own reference file are internal and dropped.
    expect(readableSource("[M] docs/reference/standards.md §8 (critical point 31.0 °C / 73.8 bar)")).toBe(
      "critical point 31.0 °C / 73.8 bar (reading)",
    );
    expect(
      readableSource("[M] safety class B2L; rises: density 0.59 × air [D] docs/reference/standards.md §4, §8"),
    ).toBe("safety class B2L (reading); rises: density 0.59 × air (derived from the cited values)");
    expect(readableSource("[S:ZZ] an odd rule")).toBe("an odd rule (source ZZ)");
  });
  it("leave no tag in any source of the built-in profiles", () => {
    for (const s of [...sources(US_FEDERAL_PROFILE), ...sources(EU_FGAS_PROFILE)]) {
      const r = readableSource(s);
      expect(r, s).not.toMatch(/\[(S:|M\]|D\])/);
      expect(r, s).not.toMatch(/source [A-Z]/); // every tag is in the citation list
    }
    const copy = withReadableSources(US_FEDERAL_PROFILE);
    expect(sources(copy).some((s) => s.includes("["))).toBe(false);
    expect(sources(US_FEDERAL_PROFILE).some((s) => s.includes("[S:"))).toBe(true); // the original keeps its tags
    expect(Object.keys(CITATIONS)).toContain("R8");
  });
});
