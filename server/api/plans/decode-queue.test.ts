import { afterAll, beforeAll, expect, it } from "vitest";
import fs from "node:fs/promises";
import os from "node:os";
import path from "node:path";
import { createTestApp, type TestApp, signIn } from "../../../tests/helpers/test-app";
import { seedCompany } from "../../../tests/helpers/fixtures";
import { makeJpeg, makePng } from "../../../tests/helpers/plan-images";
import { planImageDecoder } from "./plan-resources";

let t: TestApp;
let uploads: string;
let tmp: string;
let co: Awaited<ReturnType<typeof seedCompany>>;

beforeAll(async () => {
  uploads = await fs.mkdtemp(path.join(os.tmpdir(), "plumeline-decode-queue-"));
  tmp = await fs.mkdtemp(path.join(os.tmpdir(), "plumeline-upload-tmp-"));
  // one image decoded at a time and no waiting room: a second upload meets a full queue
  t = await createTestApp({ uploadsDir: uploads, uploadTmpDir: tmp, decodeQueue: { concurrency: 1, queueMax: 0 } });
  co = await seedCompany(t.ctx, "Larkspur Market");
});
afterAll(async () => {
  await t.close();
  await fs.rm(uploads, { recursive: true, force: true });
  await fs.rm(tmp, { recursive: true, force: true });
});

/** Whether the temporary folder empties (files go once the answer is sent), waited for up to 20 s. */
async function tmpEmpties(): Promise<boolean> {
  for (let i = 0; i < 400; i++) {
    if ((await fs.readdir(tmp)).length === 0) return true;
    await new Promise((r) => setTimeout(r, 50));
  }
  return false;
}

it("answers a plan or photo upload 503 with Retry-After while the decoding queue is full, and takes it afterwards", async () => {
  const lead = await signIn(t.app, co.people["lead-tech"]);
  const finding = await lead.post(`/api/stores/${co.store.id}/findings`, {
    component: "flare",
    note: "Oil at a flare nut",
  });
  expect(finding.status).toBe(201);
  const png = await makePng(300, 200);
  const jpeg = await makeJpeg(64, 48);
  const uploadPlan = () =>
    lead.agent.post(`/api/stores/${co.store.id}/plans`).set("X-CSRF-Token", lead.csrf).attach("image", png, "plan.png");
  const uploadPhoto = () =>
    lead.agent
      .post(`/api/findings/${finding.body.id}/photos`)
      .set("X-CSRF-Token", lead.csrf)
      .attach("photo", jpeg, "leak.jpg");

  // another upload holds the one decoding place
  const release = await planImageDecoder(t.ctx).gate.acquire();
  for (const res of [await uploadPlan(), await uploadPhoto()]) {
    expect(res.status).toBe(503);
    expect(res.headers["retry-after"]).toBe("5");
    expect(res.body.error.code).toBe("busy");
    expect(res.body.error.message).toMatch(/try again in a few seconds/);
  }
  // the refused uploads' temporary files are gone once they are answered
  expect(await tmpEmpties()).toBe(true);
  expect((await lead.get(`/api/stores/${co.store.id}/plans`)).body.plans).toHaveLength(0);

  release();
  expect((await uploadPlan()).status).toBe(201);
  expect((await uploadPhoto()).status).toBe(201);
  expect(await tmpEmpties()).toBe(true);
  // Two decodes on a cold pool and two waits for the folder: more than 30 s on a loaded machine.
}, 90_000);
