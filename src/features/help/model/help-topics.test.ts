import { describe, expect, it } from "vitest";
import { ROLES } from "#core/domain/roles";
import { HELP_TOPICS, topicsFor } from "./help-topics";

describe("help topics", () => {
  it("give every role at least one topic written for it, listed first", () => {
    for (const role of ROLES) {
      const [first] = topicsFor(role);
      expect(first.forRoles, role).toContain(role);
      expect(topicsFor(role)).toHaveLength(HELP_TOPICS.length);
    }
  });

  it("have unique ids usable in a URL", () => {
    const ids = HELP_TOPICS.map((t) => t.id);
    expect(new Set(ids).size).toBe(ids.length);
    for (const id of ids) expect(id).toMatch(/^[a-z-]+$/);
  });

  it("carry the safety caution wherever they send someone into a walk-in or machine room", () => {
    const sweep = HELP_TOPICS.find((t) => t.id === "sweep")!;
    expect(sweep.sections.flatMap((s) => s.paragraphs).join(" ")).toMatch(/local codes always come first/);
  });
});
