import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { agentFor, createTestApp, type Agent, type TestApp } from "../../../tests/helpers/test-app";
import { PASSWORD, seedCompany } from "../../../tests/helpers/fixtures";

// The statement, the records CSV and the archive read the company's settings (rules, unit, number
// format, paper) from one read of its row, however many systems the archive holds.
let t: TestApp;
let owner: Agent;
const systemIds: string[] = [];

beforeAll(async () => {
  t = await createTestApp();
  const co = await seedCompany(t.ctx, "Tansley Provisions");
  owner = await agentFor(t.app);
  await owner.post("/api/auth/sign-in", { email: co.people.owner.email, password: PASSWORD });
  for (const name of ["Rack A", "Rack B", "Rack C"]) {
    const res = await owner.post(`/api/stores/${co.store.id}/systems`, {
      name,
      refrigerantId: "R-448A",
      fullCharge: { value: 300, unit: "lb" },
      applianceType: "commercial-refrigeration",
      automaticLeakDetection: false,
    });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    systemIds.push(res.body.id);
    await owner.post(`/api/systems/${res.body.id}/charge-additions`, {
      addedOn: "2026-03-02",
      amount: { value: 12, unit: "lb" },
      reason: "Top-up",
    });
  }
}, 60_000);
afterAll(() => t.close());

/** The SQL text of every query the app sends while `run` runs. */
async function queriesDuring(run: () => Promise<unknown>): Promise<string[]> {
  const spy = vi.spyOn(t.database.pool, "query");
  try {
    await run();
    return spy.mock.calls.map(([q]) => (typeof q === "string" ? q : (q as { text: string }).text));
  } finally {
    spy.mockRestore();
  }
}
const companyReads = (sql: string[]) => sql.filter((q) => /from "companies"/.test(q));
const ruleReads = (sql: string[]) => companyReads(sql).filter((q) => q.includes('"rule_profile"'));

describe("the company's settings behind a statement", () => {
  it("are read from the company row once for a statement PDF and once for a records CSV", async () => {
    const pdf = await queriesDuring(() => owner.agent.get(`/api/systems/${systemIds[0]}/leak-rate-statement.pdf`));
    expect(companyReads(pdf)).toHaveLength(1);
    const csv = await queriesDuring(() => owner.agent.get(`/api/systems/${systemIds[0]}/records.csv`));
    expect(companyReads(csv)).toHaveLength(1);
  });

  it("are read once for the whole archive, not once per system", async () => {
    const sql = await queriesDuring(() => owner.agent.get("/api/company/records-archive.zip").buffer(true));
    // Three statements were written (one per system) from a single read of the rules.
    expect(sql.filter((q) => q.includes('from "system_revisions"')).length).toBeGreaterThanOrEqual(3);
    expect(ruleReads(sql)).toHaveLength(1);
  });
});
