import pino from "pino";
import { afterAll, beforeAll, expect, it } from "vitest";
import { createTestApp, signIn, type TestApp } from "../../../tests/helpers/test-app";
import { seedCompany } from "../../../tests/helpers/fixtures";
import { freePort } from "../../../tests/helpers/own-cluster";
import { createSmtpMailer } from "../../mail/mailer";
import { createMailQueue } from "../../mail/mail-queue";
import { outgoingMail } from "../../db/schema/index";

let t: TestApp;
let co: Awaited<ReturnType<typeof seedCompany>>;
let other: Awaited<ReturnType<typeof seedCompany>>;

beforeAll(async () => {
  t = await createTestApp();
  co = await seedCompany(t.ctx, "Larchmere Grocers");
  other = await seedCompany(t.ctx, "Osier Foods");
});
afterAll(() => t.close());

it("an owner sees the company's mail that failed after its retries, with the reason; others do not", async () => {
  const owner = await signIn(t.app, co.people.owner);
  const invited = await owner.post("/api/team/invitations", { email: "pell.garth@larchmere.test", role: "engineer" });
  await t.ctx.mailer.send({ kind: "password-reset", to: co.people.owner.email, subject: "Reset", text: "x" });
  await signIn(t.app, other.people.owner).then((o) =>
    o.post("/api/team/invitations", { email: "someone@osier.test", role: "engineer" }),
  );
  // Every message's last try against a mail server that is not there.
  const down = createMailQueue(
    t.database.db,
    createSmtpMailer({ host: "127.0.0.1", port: await freePort(), secure: false, from: "x@plumeline.test" }, true),
    pino({ level: "silent" }),
  );
  for (const r of await t.ctx.db.select({ id: outgoingMail.id }).from(outgoingMail))
    await down.deliver(r.id, true).catch(() => {});

  const res = await owner.get("/api/jobs/failed");
  expect(res.status).toBe(200);
  expect(res.body.jobs).toHaveLength(1);
  expect(res.body.jobs[0]).toMatchObject({
    kind: "invitation",
    subjectId: invited.body.id,
    to: ["pell.garth@larchmere.test"],
    attempts: 1,
    reason: "The mail server could not be reached.",
  });
  expect((await (await signIn(t.app, co.people.engineer)).get("/api/jobs/failed")).status).toBe(403);
});
