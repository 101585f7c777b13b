import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { agentFor, createTestApp, type Agent, type TestApp } from "../../../tests/helpers/test-app";
import { PASSWORD, seedCompany } from "../../../tests/helpers/fixtures";
import { caseLineFixtures } from "../../../tests/helpers/sweep-walk";
import { pdfText } from "../../../tests/helpers/pdf-text";
import { detectors } from "../../db/schema/index";
import type { Role } from "#core/domain/roles";
import { binaryBody } from "../../../tests/helpers/binary-body";

let t: TestApp;
let co: Awaited<ReturnType<typeof seedCompany>>;
let other: Awaited<ReturnType<typeof seedCompany>>;
let planId: string;
let diodeId: string;
const caseId = crypto.randomUUID();
const dropId = crypto.randomUUID();

async function as(role: Role, company = co): Promise<Agent> {
  const a = await agentFor(t.app);
  await a.post("/api/auth/sign-in", { email: company.people[role].email, password: PASSWORD });
  return a;
}

const startedAt = new Date(Date.now() - 40 * 60_000);
const at = (s: number) => new Date(startedAt.getTime() + s * 1000).toISOString();

beforeAll(async () => {
  t = await createTestApp();
  co = await seedCompany(t.ctx, "Larkspur Grocers");
  other = await seedCompany(t.ctx, "Tamarind Markets");
  const owner = await as("owner");
  const plan = await owner.post(`/api/stores/${co.store.id}/plans/blank`, { width: 30, depth: 12, unit: "m" });
  planId = plan.body.id;
  const put = await owner.put(`/api/plans/${planId}/fixtures`, {
    layoutRevision: plan.body.layoutRevision,
    fixtures: caseLineFixtures(caseId, dropId),
  });
  expect(put.status, JSON.stringify(put.body)).toBe(200);
  const [d] = await t.ctx.db
    .insert(detectors)
    .values({
      companyId: co.company.id,
      name: "Diode sniffer",
      principle: "heated-diode",
      lastCheckedOn: new Date().toISOString().slice(0, 10),
    })
    .returning();
  diodeId = d.id;
});
afterAll(async () => {
  await t.ctx.analysisRunner?.close();
  await t.close();
});

async function startSweep(a: Agent) {
  const res = await a.post(`/api/stores/${co.store.id}/sweeps`, {
    id: crypto.randomUUID(),
    planId,
    detectorId: diodeId,
    fans: "running",
    defrost: false,
    startedAt: startedAt.toISOString(),
  });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body.id as string;
}

const pass = (extra: Record<string, unknown> = {}) => ({
  fans: "stopped",
  defrost: false,
  fixtureId: caseId,
  startedAt: at(600),
  ...extra,
});
const reading = (s: number, extra: Record<string, unknown> = {}) => {
  const { s: _s, ...rest } = extra;
  return { id: crypto.randomUUID(), x: 2 + s * 0.01, y: 3.9, takenAt: at(s), ppm: 1, samplePoint: "grille", ...rest };
};

describe("PUT /api/sweeps/:id/passes/:passId", () => {
  it("starts a pinpoint pass once however often it is sent, keeps its conditions and records its end", async () => {
    const a = await as("technician");
    const sweepId = await startSweep(a);
    const passId = crypto.randomUUID();
    const first = await a.put(`/api/sweeps/${sweepId}/passes/${passId}`, pass());
    expect(first.status, JSON.stringify(first.body)).toBe(200);
    expect(first.body).toMatchObject({
      id: passId,
      sweepId,
      number: 2,
      fans: "stopped",
      defrost: false,
      endedAt: null,
    });
    // a resend with other conditions changes nothing: the readings were taken in the air first stored
    const again = await a.put(`/api/sweeps/${sweepId}/passes/${passId}`, pass({ fans: "running", defrost: true }));
    expect(again.body).toMatchObject({ fans: "stopped", defrost: false, fixtureId: caseId });
    const ended = await a.put(`/api/sweeps/${sweepId}/passes/${passId}`, pass({ endedAt: at(1500) }));
    expect(ended.body.endedAt).toBe(at(1500));
    // an older resend without the end does not undo it
    await a.put(`/api/sweeps/${sweepId}/passes/${passId}`, pass());
    const sweep = await a.get(`/api/sweeps/${sweepId}`);
    expect(sweep.body.passes).toEqual([{ ...ended.body }]);
    // a second pass is numbered after it, a defrost of the whole store
    const second = await a.put(`/api/sweeps/${sweepId}/passes/${crypto.randomUUID()}`, {
      fans: "running",
      defrost: true,
      startedAt: at(1600),
    });
    expect(second.body).toMatchObject({ number: 3, defrost: true, fixtureId: null });
  });

  it("refuses a bad pass field by field, another sweep's pass id, a reviewed sweep, and strangers", async () => {
    const a = await as("technician");
    const sweepId = await startSweep(a);
    const url = () => `/api/sweeps/${sweepId}/passes/${crypto.randomUUID()}`;
    const bad = await a.put(url(), pass({ fans: "idle", defrost: "yes", fixtureId: "case 4", startedAt: "soon" }));
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(["defrost", "fans", "fixtureId", "startedAt"]);
    const drop = await a.put(url(), pass({ fixtureId: dropId }));
    expect(drop.status).toBe(400);
    expect(drop.body.error.fields).toEqual({
      fixtureId: "is not a case, walk-in or machine room (only those have fans or a defrost)",
    });
    const nowhere = await a.put(url(), pass({ fixtureId: crypto.randomUUID() }));
    expect(nowhere.body.error.fields).toEqual({ fixtureId: "is not a fixture of the sweep's plan" });
    const early = await a.put(url(), pass({ startedAt: at(-3600), endedAt: at(-7200) }));
    expect(early.body.error.fields).toEqual({
      startedAt: "is before the sweep started",
      endedAt: "is before the pass started",
    });
    // a pass id already used by another sweep
    const used = crypto.randomUUID();
    expect((await a.put(`/api/sweeps/${sweepId}/passes/${used}`, pass())).status).toBe(200);
    const otherSweep = await startSweep(a);
    expect((await a.put(`/api/sweeps/${otherSweep}/passes/${used}`, pass())).status).toBe(409);
    // another company's technician, a store contact, nobody
    expect((await (await as("technician", other)).put(url(), pass())).status).toBe(404);
    expect((await (await as("store-contact")).put(url(), pass())).status).toBe(403);
    // a reviewed sweep takes no pass
    expect((await a.post(`/api/sweeps/${otherSweep}/submit`, {})).status).toBe(200);
    expect((await (await as("engineer")).post(`/api/sweeps/${otherSweep}/review`, {})).status).toBe(200);
    expect((await a.put(`/api/sweeps/${otherSweep}/passes/${crypto.randomUUID()}`, pass())).status).toBe(409);
  });
});

describe("readings in a pass", () => {
  it("stores each reading with its pass; an old batch without passes goes to the first pass", async () => {
    const a = await as("technician");
    const sweepId = await startSweep(a);
    const passId = crypto.randomUUID();
    await a.put(`/api/sweeps/${sweepId}/passes/${passId}`, pass());
    const old = [reading(10), reading(12)];
    const inPass = [reading(610, { passId }), reading(612, { passId })];
    const firstAgain = reading(614, { passId: null });
    const up = await a.post(`/api/sweeps/${sweepId}/readings`, { readings: [...old, ...inPass, firstAgain] });
    expect(up.body.rejected).toEqual([]);
    expect(up.body.stored).toHaveLength(5);
    const list = (await a.get(`/api/sweeps/${sweepId}/readings`)).body.readings as { id: string; passId: string }[];
    const passOf = new Map(list.map((r) => [r.id, r.passId]));
    expect(old.map((r) => passOf.get(r.id))).toEqual([null, null]);
    expect(inPass.map((r) => passOf.get(r.id))).toEqual([passId, passId]);
    expect(passOf.get(firstAgain.id)).toBeNull();
    // a resend is a duplicate, never a second reading or a move to another pass
    const resend = await a.post(`/api/sweeps/${sweepId}/readings`, { readings: [{ ...inPass[0], passId: null }] });
    expect(resend.body.duplicates).toEqual([inPass[0].id]);
    // an edit cannot move a reading to another pass: the field is not part of an edit
    const edit = await a.patch(`/api/sweeps/${sweepId}/readings/${inPass[1].id}`, { ppm: 2, passId: null });
    expect(edit.status).toBe(200);
    expect(edit.body.reading.passId).toBe(passId);
  });

  it("refuses a reading whose pass is unknown, another sweep's or not an id, alone and by field", async () => {
    const a = await as("technician");
    const sweepId = await startSweep(a);
    const elsewhere = await startSweep(a);
    const foreignPass = crypto.randomUUID();
    await a.put(`/api/sweeps/${elsewhere}/passes/${foreignPass}`, pass());
    const good = reading(20);
    const batch = [
      reading(21, { passId: crypto.randomUUID() }),
      good,
      reading(22, { passId: foreignPass }),
      reading(23, { passId: "pass two" }),
      reading(24, { passId: 7 }),
    ];
    const up = await a.post(`/api/sweeps/${sweepId}/readings`, { readings: batch });
    expect(up.status).toBe(200);
    expect(up.body.stored).toEqual([good.id]);
    expect(
      up.body.rejected.map((r: { index: number; reasons: Record<string, string> }) => [r.index, r.reasons]),
    ).toEqual([
      [0, { passId: "is not a pass of this sweep" }],
      [2, { passId: "is not a pass of this sweep" }],
      [3, { passId: "must be a valid id" }],
      [4, { passId: "must be a valid id" }],
    ]);
  });
});

/** The ppm at each tap: `c` where the probe was 6.5 s earlier, by time between taps, to a tenth of a ppm. */
function sampled(taps: { x: number; y: number; s: number }[], c: (x: number, y: number) => number) {
  return taps.map((tap) => {
    const back = tap.s - 6.5;
    let { x, y } = taps[0];
    for (let k = 1; k < taps.length; k++) {
      if (taps[k].s >= back && taps[k - 1].s <= back) {
        const f = (back - taps[k - 1].s) / (taps[k].s - taps[k - 1].s);
        x = taps[k - 1].x + f * (taps[k].x - taps[k - 1].x);
        y = taps[k - 1].y + f * (taps[k].y - taps[k - 1].y);
      }
    }
    return { s: tap.s, x: Number(tap.x.toFixed(3)), y: tap.y, ppm: Math.round(c(x, y) * 10) / 10 };
  });
}

describe("the analysis of a sweep with a pinpoint pass", () => {
  it("fits the first pass's mixed readings and the still-air pass's readings together", async () => {
    const a = await as("technician");
    const sweepId = await startSweep(a);
    const passId = crypto.randomUUID();
    const leak = { x: 8.3, y: 3 };
    // Readings from a model unlike the locator's kernel, each the air sampled 6.5 s before its tap (the
    // detector's 5 s delay and 1.5 s time constant), between taps by time.
    // First pass: the case's fans mix the gas, level at 6.5 ppm along its front, 0.5 ppm across the
    // aisle; taps 1.3 m and 1.6 s apart, east along the front and back along the aisle.
    const mixed = (_x: number, y: number) => (y < 4.5 ? 6.5 : 0.5);
    const taps: { x: number; y: number; s: number }[] = [];
    for (let k = 0; k <= 16; k++) taps.push({ x: 1 + k * 1.3, y: 3.75, s: 10 + k * 1.6 });
    for (let k = 0; k <= 16; k++) taps.push({ x: 21.8 - k * 1.3, y: 5.2, s: 38 + k * 1.6 });
    const first = sampled(taps, mixed).map((r) => reading(r.s, r));
    // The pass, fans stopped on the case: a slow walk along its front (0.6 m every 3 s), the gas falling
    // off by 0.4 per metre from the leak in still air.
    const t0 = 900;
    const still = sampled(
      Array.from({ length: 12 }, (_, k) => ({ x: 5 + k * 0.6, y: 3.9, s: t0 + k * 3 })),
      (x, y) => 1 + 30 * 0.4 ** Math.hypot(x - leak.x, y - leak.y),
    ).map((r) => reading(r.s, { ...r, passId }));
    expect((await a.put(`/api/sweeps/${sweepId}/passes/${passId}`, pass({ startedAt: at(t0 - 30) }))).status).toBe(200);
    const up = await a.post(`/api/sweeps/${sweepId}/readings`, { readings: [...first, ...still] });
    expect(up.body.rejected).toEqual([]);
    const res = await (await as("engineer")).get(`/api/sweeps/${sweepId}/analysis?wait=true`);
    expect(res.status, JSON.stringify(res.body).slice(0, 400)).toBe(200);
    const kinds = res.body.diagnostics.map((d: { kind: string }) => d.kind);
    // the first pass's readings are kept: they still say the fans mix the gas along the case
    expect(kinds).toContain("fans-mixing");
    expect(res.body.readings).toHaveLength(first.length + still.length);
    const top = res.body.candidates[0];
    expect(top, JSON.stringify(kinds)).toBeDefined();
    expect(Math.hypot(top.x - leak.x, top.y - leak.y), JSON.stringify(res.body.candidates.slice(0, 3))).toBeLessThan(1);

    // The report says which reading was in which pass, and the passes' conditions.
    const pdf = await (await as("engineer")).agent
      .get(`/api/sweeps/${sweepId}/report.pdf`)
      .buffer(true)
      .parse(binaryBody);
    expect(pdf.status).toBe(200);
    const text = (await pdfText(pdf.body as Buffer)).join("\n");
    expect(text).toMatch(/pass 1: fans running; pass 2: fans stopped at Dairy 1–4, [\d:]+–not ended/);
    // each row's point cell ends with its pass (it may wrap onto a second line)
    expect(text.match(/grille,\s+pass 2/g)).toHaveLength(still.length);
    expect(text.match(/grille,\s+pass 1/g)).toHaveLength(first.length);
  });
});
