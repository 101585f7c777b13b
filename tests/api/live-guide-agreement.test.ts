import { afterAll, beforeAll, expect, it } from "vitest";
import fs from "node:fs/promises";
import os from "node:os";
import path from "node:path";
import { toLocatorPlan } from "#core/domain/layout/to-locator-input";
import type { Fixture } from "#core/contracts/fixtures";
import type { Reading } from "#core/contracts/sweeps";
import { agentFor, createTestApp, type Agent, type TestApp } from "../helpers/test-app";
import { DEMO_SIGN_INS, seedDemoIfEmpty } from "../../server/db/seed/demo";
import { liveWorkerBody } from "../../src/features/walk/model/live-worker-body";
import { liveRequest } from "../../src/features/walk/model/live-request";
import type { LiveReply } from "../../src/features/walk/model/live-messages";

// The live estimate the phone makes (the Walk screen's worker body, fed as the screen feeds it) against
// the server's analysis after submit, on the same readings: the demo's latest sweep, read back through
// the API. The server's analysis is the reference.

let t: TestApp;
let uploads: string;
let eng: Agent;

beforeAll(async () => {
  uploads = await fs.mkdtemp(path.join(os.tmpdir(), "plumeline-live-agreement-"));
  t = await createTestApp({ uploadsDir: uploads });
  expect(await seedDemoIfEmpty(t.ctx)).toBe(true);
  eng = await agentFor(t.app);
  const person = DEMO_SIGN_INS.people.find((p) => p.role === "engineer")!;
  await eng.post("/api/auth/sign-in", { email: person.email, password: DEMO_SIGN_INS.password });
});
afterAll(async () => {
  await t.ctx.analysisRunner?.close();
  await t.close();
  await fs.rm(uploads, { recursive: true, force: true });
});

it("the live first suspect on the demo sweep's readings lies within the radius of the server analysis's first suspect", async () => {
  const storeId = (await eng.get("/api/stores")).body.stores[0].id;
  const sweeps: { id: string; startedAt: string }[] = (await eng.get(`/api/stores/${storeId}/sweeps`)).body.sweeps;
  const latest = [...sweeps].sort((a, b) => b.startedAt.localeCompare(a.startedAt))[0];
  const sweep = (await eng.get(`/api/sweeps/${latest.id}`)).body;
  const store = (await eng.get(`/api/stores/${storeId}`)).body;
  const fixtures: Fixture[] = (await eng.get(`/api/plans/${sweep.planId}/fixtures`)).body.fixtures;
  const readings: Reading[] = (await eng.get(`/api/sweeps/${latest.id}/readings`)).body.readings;

  const analysis = await eng.get(`/api/sweeps/${latest.id}/analysis`);
  expect(analysis.status).toBe(200);
  const server = analysis.body.candidates[0];
  expect(server).toBeDefined();

  const plan = toLocatorPlan({ width: store.currentPlan.widthM, height: store.currentPlan.heightM }, fixtures, {
    fansRunning: sweep.fans === "running",
  });
  const replies: LiveReply[] = [];
  const tasks: (() => void)[] = [];
  const body = liveWorkerBody({ post: (r) => replies.push(r), later: (f) => tasks.push(f), now: () => 0 });
  body.receive(JSON.parse(JSON.stringify(liveRequest(1, sweep, plan, readings))));
  while (tasks.length) tasks.shift()!();
  const estimate = replies.find((r) => r.kind === "estimate");
  expect(estimate?.kind === "estimate" && estimate.estimate.kind).toBe("suspects");
  if (estimate?.kind !== "estimate" || estimate.estimate.kind !== "suspects") return;
  const live = estimate.estimate.suspects[0];
  expect(Math.hypot(live.x - server.x, live.y - server.y)).toBeLessThanOrEqual(server.radius);
  expect(live.fixtureId).toBe(server.fixtureId);
  // and the live estimate fitted a window of the plan, not the whole store
  expect(estimate.estimate.box.width * estimate.estimate.box.height).toBeLessThan(
    store.currentPlan.widthM * store.currentPlan.heightM,
  );
});
