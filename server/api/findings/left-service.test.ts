import Papa from "papaparse";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createTestApp, type Agent, type TestApp, signInOnce } from "../../../tests/helpers/test-app";
import { seedCompany } from "../../../tests/helpers/fixtures";
import { binaryBody } from "../../../tests/helpers/binary-body";
import { pdfText } from "../../../tests/helpers/pdf-text";
import { unzip } from "../../../tests/helpers/unzip";
import { addMonths } from "#core/domain/dates/calendar-date";
import { localDateOf } from "#core/domain/dates/time-zone";
import type { Role } from "#core/domain/roles";

let t: TestApp;
let co: Awaited<ReturnType<typeof seedCompany>>;
let eu: Awaited<ReturnType<typeof seedCompany>>;
const signInOnceAs = signInOnce(() => t.app);

beforeAll(async () => {
  t = await createTestApp();
  co = await seedCompany(t.ctx, "Wrenfield Provisions");
  eu = await seedCompany(t.ctx, "Heidemoor Frischkauf");
  const owner = await signInOnceAs(eu.people.owner);
  const settings = {
    name: "Heidemoor Frischkauf",
    lengthUnit: "m",
    massUnit: "kg",
    ruleProfile: "eu-fgas",
    leakRateMethod: "annualizing",
    detectorCheckIntervalDays: 30,
  };
  expect((await owner.put("/api/company/settings", settings)).status).toBe(200);
});
afterAll(() => t.close());

const signedIn = (role: Role, company = co): Promise<Agent> => signInOnceAs(company.people[role]);
const lb = (value: number) => ({ value, unit: "lb" });
const RETIRED = "2026-04-30";

type TodayFinding = { id: string; deadline: string | null; systemRetiredOn?: string | null };
type Due = { kind: string; systemId: string | null; findingId: string | null };

async function newSystem(company: typeof co, name: string, fullCharge: { value: number; unit: string }) {
  const res = await (await signedIn("lead-tech", company)).post(`/api/stores/${company.store.id}/systems`, {
    name,
    refrigerantId: "R-404A",
    fullCharge,
    applianceType: "commercial-refrigeration",
    automaticLeakDetection: false,
    inServiceOn: "2026-01-01",
  });
  expect(res.status).toBe(201);
  return res.body.id as string;
}

async function confirmedFinding(tech: Agent, company: typeof co, systemId: string, foundAt: string) {
  const res = await tech.post(`/api/stores/${company.store.id}/findings`, {
    systemId,
    status: "confirmed",
    component: "brazed-joint",
    foundAt,
  });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body.id as string;
}

describe("a finding closed because its system left service (docs/decisions/0166)", () => {
  it("stops the repair clock and due items at the retirement, refuses later steps, and closes with an audit row", async () => {
    const tech = await signedIn("technician");
    const engineer = await signedIn("engineer");
    const id = await newSystem(co, "Rack E (medium temp)", lb(200));
    // 12 lb into 200 lb 60 days after entering service: 12/200 ÷ (60/365) = 36.5 %, over the 20 %
    // commercial threshold (40 CFR 84.106, docs/reference/standards.md §1 [S:R4]; annualizing [S:R7]).
    expect(
      (
        await tech.post(`/api/systems/${id}/charge-additions`, {
          addedOn: "2026-03-02",
          amount: lb(12),
          reason: "top-up",
        })
      ).status,
    ).toBe(201);
    const repairedOne = await confirmedFinding(tech, co, id, "2026-03-03T15:00:00Z");
    expect(
      (await tech.post(`/api/findings/${repairedOne}/events`, { action: "repair", on: "2026-03-10" })).status,
    ).toBe(200);
    // 10 lb 30 days later: 10/200 ÷ (30/365) = 60.8 % [D]: a new breach, 30 days to repair from 1 Apr [S:R4].
    expect(
      (
        await tech.post(`/api/systems/${id}/charge-additions`, {
          addedOn: "2026-04-01",
          amount: lb(10),
          reason: "top-up",
        })
      ).status,
    ).toBe(201);
    const unrepaired = await confirmedFinding(tech, co, id, "2026-04-02T15:00:00Z");

    // Before the retirement: the initial verification test and the repair are due on Today.
    let today = (await engineer.get("/api/today")).body;
    const mine = (d: Due) => d.systemId === id;
    expect(today.due.filter(mine).map((d: Due) => d.kind)).toEqual(expect.arrayContaining(["initial-test", "repair"]));
    expect(today.openFindings.find((f: TodayFinding) => f.id === unrepaired).deadline).toBe("2026-05-01");

    const lead = await signedIn("lead-tech");
    const retire = await lead.post(`/api/systems/${id}/retire`, { retiredOn: RETIRED, reasonKind: "removed" });
    expect(retire.status, JSON.stringify(retire.body)).toBe(200);

    // After it: nothing is owed on the system, and both findings wait to be closed as left service.
    today = (await engineer.get("/api/today")).body;
    expect(today.due.filter(mine)).toEqual([]);
    for (const f of [repairedOne, unrepaired])
      expect(today.openFindings.find((x: TodayFinding) => x.id === f)).toMatchObject({
        deadline: null,
        systemRetiredOn: RETIRED,
      });
    const detail = (await engineer.get(`/api/findings/${unrepaired}`)).body;
    expect(detail).toMatchObject({ systemRetiredOn: RETIRED, deadlines: [] });
    expect(detail.nextActions).toEqual(["close-left-service", "repair", "dismiss"]);

    // A repair or test dated after the retirement day is refused at its field, naming the day.
    const lateRepair = await tech.post(`/api/findings/${unrepaired}/events`, { action: "repair", on: "2026-05-02" });
    expect(lateRepair.status).toBe(400);
    expect(lateRepair.body.error.fields.on).toBe(
      "must not be after 30 Apr 2026, the day Rack E (medium temp) left service: record a step taken by then, or close the finding because the system left service",
    );
    const lateTest = await tech.post(`/api/findings/${repairedOne}/events`, {
      action: "initial-test",
      result: "passed",
    });
    expect(lateTest.status).toBe(400);
    expect(lateTest.body.error.fields.on).toMatch(/^must not be after 30 Apr 2026/);

    // Technicians record; engineers and owners close.
    expect((await tech.post(`/api/findings/${unrepaired}/events`, { action: "close-left-service" })).status).toBe(403);
    const early = await engineer.post(`/api/findings/${unrepaired}/events`, {
      action: "close-left-service",
      on: "2026-04-29",
    });
    expect(early.status).toBe(400);
    expect(early.body.error.fields.on).toBe(
      "must not be before 30 Apr 2026, the day Rack E (medium temp) left service",
    );

    const closed = await engineer.post(`/api/findings/${unrepaired}/events`, {
      action: "close-left-service",
      note: "Rack removed with the store refit",
    });
    expect(closed.status, JSON.stringify(closed.body)).toBe(200);
    const storeToday = localDateOf(new Date(), co.store.timeZone);
    expect(closed.body).toMatchObject({ status: "closed", nextActions: [] });
    expect(closed.body.events.at(-1)).toMatchObject({
      kind: "closed-left-service",
      status: "closed",
      on: storeToday,
      by: "engineer of Wrenfield Provisions",
    });
    const onTheDay = await engineer.post(`/api/findings/${repairedOne}/events`, {
      action: "close-left-service",
      on: RETIRED,
    });
    expect(onTheDay.status, JSON.stringify(onTheDay.body)).toBe(200);
    // Closed is closed: nothing more is added.
    expect((await tech.post(`/api/findings/${unrepaired}/events`, { action: "repair", on: RETIRED })).status).toBe(409);

    today = (await engineer.get("/api/today")).body;
    expect(today.openFindings.map((f: TodayFinding) => f.id)).not.toContain(unrepaired);
    expect(today.openFindings.map((f: TodayFinding) => f.id)).not.toContain(repairedOne);
    expect(today.due.filter(mine)).toEqual([]);

    // The audit trail says who closed each and when; retention runs from the later closing (3 years, [S:R6,R7]).
    const rec = (await engineer.get(`/api/systems/${id}/records`)).body;
    const closings = rec.audit.filter((a: { action: string }) => a.action === "finding-closed-left-service");
    expect(closings).toHaveLength(2);
    expect(closings.map((a: { by: string }) => a.by)).toEqual([
      "engineer of Wrenfield Provisions",
      "engineer of Wrenfield Provisions",
    ]);
    expect(closings.map((a: { summary: string }) => a.summary)).toContain(
      `Finding of 2026-04-02 (brazed joint, confirmed) closed on ${storeToday}: Rack E (medium temp) left service on ${RETIRED}; no repair, verification or leak check is owed on it`,
    );
    expect(rec.retention).toMatchObject({ years: 3, keptUntil: addMonths(storeToday, 36) });
    expect(rec.due).toEqual([]);

    // The statement and the records CSV show both closed because the system left service.
    const pdf = await engineer.agent.get(`/api/systems/${id}/leak-rate-statement.pdf`).buffer(true).parse(binaryBody);
    expect(pdf.status).toBe(200);
    const text = (await pdfText(pdf.body as Buffer)).join(" ").replace(/\s+/g, " ");
    expect(text.match(/Brazed joint – closed: the system left service on 30 Apr 2026/g)).toHaveLength(2);
    expect(text).toContain("Closed: the system left service");
    const csv = Papa.parse<Record<string, string>>((await engineer.get(`/api/systems/${id}/records.csv`)).text, {
      header: true,
      skipEmptyLines: true,
    }).data;
    expect(csv.filter((r) => r.record === "finding closed-left-service").map((r) => [r.finding_id, r.status])).toEqual(
      expect.arrayContaining([
        [unrepaired, "closed"],
        [repairedOne, "closed"],
      ]),
    );

    // The owner's archive keeps the step's kind and the audit row as stored (docs/decisions/0046).
    const zip = await (await signedIn("owner")).agent
      .get("/api/company/records-archive.zip")
      .buffer(true)
      .parse(binaryBody);
    expect(zip.status).toBe(200);
    const files = await unzip(zip.body as Buffer);
    const table = (name: string) =>
      Papa.parse<Record<string, string>>(files.get(`tables/${name}`)!.toString("utf8"), {
        header: true,
        skipEmptyLines: true,
      }).data;
    const steps = table("finding-steps.csv").filter((r) => r.kind === "closed-left-service");
    expect(steps.map((r) => [r.finding_id, r.status, r.on]).sort()).toEqual(
      [
        [unrepaired, "closed", storeToday],
        [repairedOne, "closed", RETIRED],
      ].sort(),
    );
    expect(table("compliance-audit.csv").filter((r) => r.action === "finding-closed-left-service")).toHaveLength(2);
  });

  it("is refused while the system is in service (409 with the reason), and no step lands", async () => {
    const tech = await signedIn("technician");
    const id = await newSystem(co, "Rack G", lb(200));
    const f = await confirmedFinding(tech, co, id, "2026-05-02T15:00:00Z");
    const res = await (await signedIn("owner")).post(`/api/findings/${f}/events`, { action: "close-left-service" });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toBe(
      "This finding is confirmed: its system is in service; a finding closes this way only once its system has been retired.",
    );
    expect((await tech.get(`/api/findings/${f}`)).body.events.map((e: { kind: string }) => e.kind)).toEqual([
      "found",
      "confirmed",
    ]);
  });

  it("under EU rules the re-check after a repair stops being due, and the finding closes as left service ([S:E6])", async () => {
    const tech = await signedIn("technician", eu);
    const id = await newSystem(eu, "Kühlstelle 3", { value: 20, unit: "kg" });
    const f = await confirmedFinding(tech, eu, id, "2026-03-03T10:00:00+01:00");
    expect((await tech.post(`/api/findings/${f}/events`, { action: "repair", on: "2026-03-05" })).status).toBe(200);
    const engineer = await signedIn("engineer", eu);
    // A leak check within a month of the repair is due (Regulation (EU) 2024/573, docs/reference/standards.md §2 [S:E6]).
    let due = (await engineer.get(`/api/systems/${id}/records`)).body.due.map((d: { kind: string }) => d.kind);
    expect(due).toContain("recheck-after-repair");
    const lead = await signedIn("lead-tech", eu);
    expect(
      (await lead.post(`/api/systems/${id}/retire`, { retiredOn: "2026-03-20", reasonKind: "replaced" })).status,
    ).toBe(200);
    due = (await engineer.get(`/api/systems/${id}/records`)).body.due;
    expect(due).toEqual([]);
    expect((await engineer.get(`/api/findings/${f}`)).body.nextActions).toEqual(["close-left-service"]);
    const closed = await engineer.post(`/api/findings/${f}/events`, { action: "close-left-service", on: "2026-03-20" });
    expect(closed.status, JSON.stringify(closed.body)).toBe(200);
    expect(closed.body.status).toBe("closed");
  });
});
