/**
 * Upload benchmark: does memory stay bounded when large uploads arrive together? The real server
 * runs as a child process (node --import tsx server/index.ts); eight maximum-size uploads are sent
 * at once: four plans that decode to the pixel budget (40 megapixels in a small PNG file) and four
 * photos at the size limit (15 MB JPEGs). The server's resident memory is sampled from
 * /proc/PID/status during the burst (and its peak, VmHWM, reset just before). Targets (the issue's):
 * the rise stays under 600 MB and every upload gets an answer: success, or a clear 503 or 413.
 *
 *   bash scripts/pg.sh start test 55200
 *   BENCH_DATABASE_URL=postgres://postgres@127.0.0.1:55200/postgres npm run bench:uploads
 *
 * Optional: BENCH_PLANS (default 4), BENCH_PHOTOS (default 4); the server's own variables
 * (CPU_WORKERS, DECODE_CONCURRENCY, DECODE_QUEUE_MAX, ...) pass through to it.
 */
import { readFileSync, writeFileSync } from "node:fs";
import os from "node:os";
import { deflateSync, crc32 } from "node:zlib";
import { Jimp, JimpMime } from "jimp";

const adminUrl = process.env.BENCH_DATABASE_URL ?? process.env.TEST_ADMIN_DATABASE_URL;
if (!adminUrl) {
  console.error(
    "Set BENCH_DATABASE_URL (or TEST_ADMIN_DATABASE_URL), e.g. postgres://postgres@127.0.0.1:55200/postgres",
  );
  process.exit(2);
}
process.env.TEST_ADMIN_DATABASE_URL = adminUrl;

const { createTestDatabase } = await import("../../tests/helpers/test-db");
const { seedCompany, PASSWORD } = await import("../../tests/helpers/fixtures");
const { startAppProcess } = await import("../../tests/helpers/app-process");
const { DEFAULT_PLAN_IMAGE_LIMITS } = await import("../../server/api/plans/plan-resources");
const { PHOTO_LIMITS } = await import("../../server/api/findings/finding-photos.service");

const TARGET_MB = 600;
const PLANS = Number(process.env.BENCH_PLANS ?? 4);
const PHOTOS = Number(process.env.BENCH_PHOTOS ?? 4);
const MB = 1024 * 1024;

function pngChunk(type: string, data: Buffer): Buffer {
  const len = Buffer.alloc(4);
  len.writeUInt32BE(data.length);
  const body = Buffer.concat([Buffer.from(type, "ascii"), data]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(body) >>> 0);
  return Buffer.concat([len, body, crc]);
}

/** A white RGB PNG of width × height with a grey grid (PNG spec §11.2.2 IHDR, §9 filter 0): a small file, a huge bitmap. */
function bigPlanPng(width: number, height: number): Buffer {
  const stride = 1 + width * 3;
  const raw = Buffer.alloc(stride * height, 0xff);
  for (let y = 0; y < height; y++) {
    raw[y * stride] = 0; // filter: none
    const onLine = y % 200 === 0;
    for (let x = 0; x < width; x += onLine ? 1 : 200) raw.fill(0x60, y * stride + 1 + x * 3, y * stride + 4 + x * 3);
  }
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(width, 0);
  ihdr.writeUInt32BE(height, 4);
  ihdr[8] = 8; // bit depth
  ihdr[9] = 2; // colour type: truecolour
  const signature = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
  return Buffer.concat([
    signature,
    pngChunk("IHDR", ihdr),
    pngChunk("IDAT", deflateSync(raw, { level: 6 })),
    pngChunk("IEND", Buffer.alloc(0)),
  ]);
}

/**
 * A noisy JPEG (phone photos of machinery are busy images) padded after its end marker to just under
 * the photo limit: decoders stop at EOI, so the file is as large as allowed and decodes as it is.
 */
async function bigPhotoJpeg(limitBytes: number): Promise<Buffer> {
  const width = 4000;
  const height = 3000;
  const img = new Jimp({ width, height, color: 0xffffffff });
  const data = img.bitmap.data;
  let seed = 12345;
  for (let i = 0; i < data.length; i++) {
    seed = (seed * 1103515245 + 12345) & 0x7fffffff;
    if ((i & 3) !== 3) data[i] = seed >> 23;
  }
  let jpeg = await img.getBuffer(JimpMime.jpeg, { quality: 92 });
  if (jpeg.length > limitBytes - 1024) jpeg = await img.getBuffer(JimpMime.jpeg, { quality: 60 });
  return Buffer.concat([jpeg, Buffer.alloc(limitBytes - 1024 - jpeg.length)]);
}

function rssMb(pid: number, field: "VmRSS" | "VmHWM"): number {
  const m = new RegExp(`${field}:\\s+(\\d+) kB`).exec(readFileSync(`/proc/${pid}/status`, "utf8"));
  return m ? Number(m[1]) / 1024 : Number.NaN;
}

const plansPixels = Math.floor(Math.sqrt(DEFAULT_PLAN_IMAGE_LIMITS.maxPixels * 1.4));
const planW = plansPixels;
const planH = Math.floor(DEFAULT_PLAN_IMAGE_LIMITS.maxPixels / planW);
const planPng = bigPlanPng(planW, planH);
const photo = await bigPhotoJpeg(PHOTO_LIMITS.maxBytes);

const database = await createTestDatabase();
const co = await seedCompany({ db: database.db }, "Fernhollow Provisions");
const app = await startAppProcess({ DATABASE_URL: database.url, LOG_LEVEL: "error" });
const pid = app.child.pid!;
let failed = false;
try {
  const session = await fetch(`${app.url}/api/auth/session`);
  const cookie = session.headers.getSetCookie()[0].split(";")[0];
  let { csrfToken } = (await session.json()) as { csrfToken: string };
  const signIn = await fetch(`${app.url}/api/auth/sign-in`, {
    method: "POST",
    headers: { "Content-Type": "application/json", Cookie: cookie, "X-CSRF-Token": csrfToken },
    body: JSON.stringify({ email: co.people["lead-tech"].email, password: PASSWORD }),
  });
  if (signIn.status !== 200) throw new Error(`sign-in gave ${signIn.status}: ${await signIn.text()}`);
  const signedCookie = signIn.headers.getSetCookie()[0]?.split(";")[0] ?? cookie;
  const now = await fetch(`${app.url}/api/auth/session`, { headers: { Cookie: signedCookie } });
  csrfToken = ((await now.json()) as { csrfToken: string }).csrfToken;
  const headers = { Cookie: signedCookie, "X-CSRF-Token": csrfToken };
  const findingIds: string[] = [];
  for (let i = 0; i < PHOTOS; i++) {
    const res = await fetch(`${app.url}/api/stores/${co.store.id}/findings`, {
      method: "POST",
      headers: { ...headers, "Content-Type": "application/json" },
      body: JSON.stringify({ component: "flare", note: `Oil stain ${i + 1}` }),
    });
    if (res.status !== 201) throw new Error(`creating a finding gave ${res.status}: ${await res.text()}`);
    findingIds.push(((await res.json()) as { id: string }).id);
  }

  const upload = async (url: string, field: string, bytes: Buffer, name: string, type: string) => {
    const form = new FormData();
    form.append(field, new Blob([new Uint8Array(bytes)], { type }), name);
    const started = performance.now();
    const res = await fetch(url, { method: "POST", headers, body: form }).catch((err: Error) => err);
    const ms = Math.round(performance.now() - started);
    if (res instanceof Error) return { name, status: `no answer (${res.message})`, ms };
    const body = (await res.json().catch(() => ({}))) as { error?: { code?: string } };
    return { name, status: res.status, code: body.error?.code, retryAfter: res.headers.get("retry-after"), ms };
  };

  await new Promise((r) => setTimeout(r, 500));
  const baseline = rssMb(pid, "VmRSS");
  writeFileSync(`/proc/${pid}/clear_refs`, "5"); // resets VmHWM, the peak (Linux proc(5))
  let sampledPeak = baseline;
  const sampler = setInterval(() => {
    sampledPeak = Math.max(sampledPeak, rssMb(pid, "VmRSS"));
  }, 20);
  const started = performance.now();
  const results = await Promise.all([
    ...Array.from({ length: PLANS }, (_, i) =>
      upload(`${app.url}/api/stores/${co.store.id}/plans`, "image", planPng, `plan-${i + 1}.png`, "image/png"),
    ),
    ...findingIds.map((id, i) =>
      upload(`${app.url}/api/findings/${id}/photos`, "photo", photo, `photo-${i + 1}.jpg`, "image/jpeg"),
    ),
  ]);
  const seconds = ((performance.now() - started) / 1000).toFixed(1);
  clearInterval(sampler);
  const peak = Math.max(sampledPeak, rssMb(pid, "VmHWM"));
  const rise = peak - baseline;
  const answered = results.every((r) => r.status === 201 || r.status === 503 || r.status === 413);
  for (const r of results)
    console.log(
      `  ${r.name.padEnd(12)} ${String(r.status).padEnd(4)} ${r.code ?? ""}${r.retryAfter ? ` Retry-After ${r.retryAfter}` : ""} ${r.ms} ms`,
    );
  console.log(
    `uploads: ${PLANS} plans of ${planW} × ${planH} px (${((planW * planH) / 1e6).toFixed(1)} MP, ${(planPng.length / 1024).toFixed(0)} KB) ` +
      `and ${PHOTOS} photos of ${(photo.length / MB).toFixed(1)} MB at once, in ${seconds} s; server RSS ${baseline.toFixed(0)} MB before, ` +
      `peak ${peak.toFixed(0)} MB, rise ${rise.toFixed(0)} MB (target < ${TARGET_MB} MB: ${rise < TARGET_MB ? "met" : "NOT met"}); ` +
      `every upload answered 201/413/503: ${answered ? "yes" : "NO"}; load average ${os.loadavg()[0].toFixed(1)}`,
  );
  failed = !answered || rise >= TARGET_MB;
} finally {
  app.kill("SIGTERM");
  await app.exited;
  await database.drop();
}
process.exit(failed ? 1 : 0);
