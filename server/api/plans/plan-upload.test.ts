import { afterAll, beforeAll, beforeEach, describe, expect, it } from "vitest";
import fs from "node:fs/promises";
import os from "node:os";
import path from "node:path";
import { count, eq } from "drizzle-orm";
import { imageSize } from "image-size";
import { plans } from "../../db/schema/index";
import { agentFor, createTestApp, type Agent, type TestApp, signIn } from "../../../tests/helpers/test-app";
import { seedCompany } from "../../../tests/helpers/fixtures";
import { makeJpeg, makePng, pngHeaderOnly, withExifOrientation } from "../../../tests/helpers/plan-images";
import { createDiskStorage } from "../../storage/disk-storage";
import type { Role } from "#core/domain/roles";

let t: TestApp;
let uploads: string;
let co: Awaited<ReturnType<typeof seedCompany>>;
let other: Awaited<ReturnType<typeof seedCompany>>;

beforeAll(async () => {
  uploads = await fs.mkdtemp(path.join(os.tmpdir(), "plumeline-uploads-"));
  t = await createTestApp({ uploadsDir: uploads, planImageLimits: { displayMaxSide: 400, thumbMaxSide: 64 } });
  co = await seedCompany(t.ctx, "Birchfield Foods");
  other = await seedCompany(t.ctx, "Quarry Lane Grocers");
});
afterAll(async () => {
  await t.close();
  await fs.rm(uploads, { recursive: true, force: true });
});
beforeEach(() => {
  t.ctx.storage = undefined;
});

const signedIn = (role: Role, company = co): Promise<Agent> => signIn(t.app, company.people[role]);

function upload(a: Agent, storeId: string, data: Buffer, filename: string) {
  return a.agent.post(`/api/stores/${storeId}/plans`).set("X-CSRF-Token", a.csrf).attach("image", data, filename);
}

async function filesUnder(dir: string): Promise<string[]> {
  const entries = await fs.readdir(dir, { recursive: true, withFileTypes: true });
  return entries
    .filter((e) => e.isFile())
    .map((e) => path.relative(dir, path.join(e.parentPath, e.name)))
    .sort();
}

async function planCount(storeId: string): Promise<number> {
  const [r] = await t.ctx.db.select({ n: count() }).from(plans).where(eq(plans.storeId, storeId));
  return Number(r.n);
}

describe("plan upload: accepted images", () => {
  it("keeps a PNG's original, a capped display copy and a thumbnail, served only to members", async () => {
    const lead = await signedIn("lead-tech");
    const png = await makePng(800, 500);
    const res = await upload(lead, co.store.id, png, "ground-floor.png");
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({
      version: 1,
      source: "image",
      calibrated: false,
      metresPerPixel: null,
      layoutRevision: 0,
    });
    // The display copy's longest side is capped (400 in this app), aspect kept: 800×500 → 400×250.
    expect(res.body.image).toMatchObject({
      widthPx: 400,
      heightPx: 250,
      originalWidthPx: 800,
      originalHeightPx: 500,
      originalMime: "image/png",
    });

    const original = await lead.agent.get(res.body.image.originalUrl).buffer(true);
    expect(original.status).toBe(200);
    expect(original.headers["content-type"]).toBe("image/png");
    expect(Buffer.compare(original.body, png)).toBe(0);
    const display = await lead.agent.get(res.body.image.displayUrl).buffer(true);
    expect(imageSize(display.body)).toMatchObject({ width: 400, height: 250 });
    const thumb = await lead.agent.get(res.body.image.thumbUrl).buffer(true);
    expect(imageSize(thumb.body)).toMatchObject({ width: 64, height: 40 });

    const files = await filesUnder(uploads);
    expect(files.filter((f) => f.includes(res.body.id))).toHaveLength(3);
    expect(files.some((f) => f.endsWith(".part"))).toBe(false);

    // Technicians read; strangers, other companies and out-of-scope contacts get 404 or 401.
    expect((await (await signedIn("technician")).agent.get(res.body.image.thumbUrl)).status).toBe(200);
    expect((await (await signedIn("owner", other)).agent.get(res.body.image.thumbUrl)).status).toBe(404);
    expect((await (await agentFor(t.app)).agent.get(res.body.image.thumbUrl)).status).toBe(401);
    expect((await lead.agent.get(`/api/plans/${res.body.id}/image?variant=huge`)).status).toBe(400);
  });

  it("accepts a JPEG and applies its EXIF orientation to the display copy", async () => {
    const lead = await signedIn("owner");
    // Stored 300×200 with orientation 6 (rotate 90° clockwise): viewed upright it is 200×300.
    const jpeg = withExifOrientation(await makeJpeg(300, 200), 6);
    const res = await upload(lead, co.otherStore.id, jpeg, "scan.jpg");
    expect(res.status).toBe(201);
    expect(res.body.image).toMatchObject({ originalMime: "image/jpeg", widthPx: 200, heightPx: 300 });
    const display = await lead.agent.get(res.body.image.displayUrl).buffer(true);
    expect(display.headers["content-type"]).toBe("image/jpeg");
    expect(imageSize(display.body)).toMatchObject({ width: 200, height: 300 });
  });
});

describe("plan upload: refused files leave nothing behind", () => {
  const cases: [string, () => Promise<Buffer>, string, number, RegExp][] = [
    [
      "a text file renamed .png",
      async () => Buffer.from("Aisle 4: dairy, eggs, cheese\n".repeat(20)),
      "plan.png",
      415,
      /not a PNG or JPEG image/,
    ],
    [
      "a truncated PNG",
      async () => (await makePng(600, 400)).subarray(0, 400),
      "cut.png",
      422,
      /damaged or incomplete/,
    ],
    [
      "a truncated JPEG",
      async () => {
        const j = await makeJpeg(600, 400);
        return j.subarray(0, Math.floor(j.length / 3));
      },
      "cut.jpg",
      422,
      /damaged or incomplete/,
    ],
    [
      "a header declaring 10000 × 10000 px",
      async () => pngHeaderOnly(10_000, 10_000),
      "bomb.png",
      413,
      /10000 × 10000 px \(100\.0 megapixels\); plans may have at most 40 megapixels/,
    ],
    ["an empty file", async () => Buffer.alloc(0), "empty.png", 422, /empty/],
  ];
  it.each(cases)("refuses %s with a clear message", async (_name, make, filename, status, message) => {
    const lead = await signedIn("lead-tech");
    const before = await filesUnder(uploads);
    const plansBefore = await planCount(co.store.id);
    const res = await upload(lead, co.store.id, await make(), filename);
    expect(res.status).toBe(status);
    expect(res.body.error.message).toMatch(message);
    expect(await filesUnder(uploads)).toEqual(before);
    expect(await planCount(co.store.id)).toBe(plansBefore);
  });

  it("refuses a file over 25 MB with 413 before decoding it", async () => {
    const lead = await signedIn("lead-tech");
    const before = await filesUnder(uploads);
    const plansBefore = await planCount(co.store.id);
    const big = Buffer.concat([await makePng(10, 10), Buffer.alloc(25 * 1024 * 1024 + 1)]);
    const res = await upload(lead, co.store.id, big, "huge.png");
    expect(res.status).toBe(413);
    expect(res.body.error.message).toMatch(/larger than 25 MB/);
    expect(await filesUnder(uploads)).toEqual(before);
    expect(await planCount(co.store.id)).toBe(plansBefore);
  });

  it("removes the files already written when a later write fails", async () => {
    const disk = createDiskStorage(uploads);
    let puts = 0;
    t.ctx.storage = {
      ...disk,
      async put(key, data) {
        puts += 1;
        if (puts === 3) throw new Error("disk full");
        await disk.put(key, data);
      },
    };
    const lead = await signedIn("lead-tech");
    const before = await filesUnder(uploads);
    const plansBefore = await planCount(co.store.id);
    const res = await upload(lead, co.store.id, await makePng(120, 80), "plan.png");
    expect(res.status).toBe(500);
    expect(puts).toBe(3);
    expect(await filesUnder(uploads)).toEqual(before);
    expect(await planCount(co.store.id)).toBe(plansBefore);
  });

  it("asks for the file when none is attached, and checks roles and stores first", async () => {
    const lead = await signedIn("lead-tech");
    const none = await lead.post(`/api/stores/${co.store.id}/plans`, {});
    expect(none.status).toBe(400);
    expect(none.body.error.fields.image).toMatch(/required/);
    const png = await makePng(50, 50);
    expect((await upload(await signedIn("technician"), co.store.id, png, "p.png")).status).toBe(403);
    expect((await upload(await signedIn("engineer"), co.store.id, png, "p.png")).status).toBe(403);
    expect((await upload(await signedIn("owner", other), co.store.id, png, "p.png")).status).toBe(404);
  });
});
