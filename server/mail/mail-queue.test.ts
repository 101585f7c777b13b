import net from "node:net";
import pino from "pino";
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, expect, it } from "vitest";
import { createTestApp, drainMail, signIn, type TestApp } from "../../tests/helpers/test-app";
import { seedCompany } from "../../tests/helpers/fixtures";
import { freePort } from "../../tests/helpers/own-cluster";
import { invitations, outboxMessages, outgoingMail } from "../db/schema/index";
import { createSmtpMailer } from "./mailer";
import { createMailQueue, type MailQueue } from "./mail-queue";

let t: TestApp;
let co: Awaited<ReturnType<typeof seedCompany>>;
let silent: net.Server;
const logger = pino({ level: "silent" });

beforeAll(async () => {
  t = await createTestApp();
  co = await seedCompany(t.ctx, "Thistledown Foods");
  // A mail server that accepts the connection and never says a word.
  silent = net.createServer(() => {});
  await new Promise<void>((r) => silent.listen(0, "127.0.0.1", () => r()));
});
afterAll(async () => {
  silent.close();
  await t.close();
});

/** A worker of another process whose mail server is at `port`. */
function workerTo(port: number, timeoutMs = 2_000): MailQueue {
  return createMailQueue(
    t.database.db,
    createSmtpMailer(
      { host: "127.0.0.1", port, secure: false, from: "Plumeline <no-reply@plumeline.test>", timeoutMs },
      true,
    ),
    logger,
  );
}

async function mailsTo(email: string) {
  return t.ctx.db
    .select()
    .from(outboxMessages)
    .where(eq(outboxMessages.to, [email]));
}

it("an invitation while the mail server is down: queued at once, the reason shown, failed after the last try, sent once by a retry, never a second invitation", async () => {
  const owner = await signIn(t.app, co.people.owner);
  const email = "rowan.ash@thistledown.test";
  const sent = await owner.post("/api/team/invitations", { email, role: "technician" });
  expect(sent.status).toBe(201);
  expect(sent.body.delivery).toMatchObject({ state: "queued", attempts: 0 });

  const down = workerTo(await freePort());
  await expect(down.deliver(sent.body.delivery.mailId, false)).rejects.toThrow();
  let team = (await owner.get("/api/team")).body;
  expect(team.invitations.find((i: { id: string }) => i.id === sent.body.id).delivery).toMatchObject({
    state: "queued",
    attempts: 1,
    error: "The mail server could not be reached.",
  });
  await expect(down.deliver(sent.body.delivery.mailId, true)).rejects.toThrow();
  team = (await owner.get("/api/team")).body;
  expect(team.invitations.find((i: { id: string }) => i.id === sent.body.id).delivery).toMatchObject({
    state: "failed",
    attempts: 2,
  });

  // The owner tries again, by the button or by inviting the same address: one invitation throughout.
  const again = await owner.post("/api/team/invitations", { email, role: "technician" });
  expect(again.status).toBe(200);
  expect(again.body.id).toBe(sent.body.id);
  expect(again.body.delivery).toMatchObject({ mailId: sent.body.delivery.mailId, state: "queued", attempts: 0 });
  expect(await t.ctx.db.select().from(invitations).where(eq(invitations.email, email))).toHaveLength(1);

  expect(await drainMail(t)).toBe(1);
  expect(await drainMail(t)).toBe(0);
  const caught = await mailsTo(email);
  expect(caught).toHaveLength(1);
  expect(caught[0].text).toMatch(/\/invite\/[A-Za-z0-9_-]+/);
  // Sent: the body with its sign-in link is not kept in the queue.
  const [row] = await t.ctx.db.select().from(outgoingMail).where(eq(outgoingMail.id, sent.body.delivery.mailId));
  expect(row).toMatchObject({ state: "sent", text: "", attachments: [] });
  expect((await owner.get("/api/team")).body.invitations[0].delivery).toMatchObject({ state: "sent", error: null });
});

it("a mail server that never answers fails the attempt after the short timeout, with that reason", async () => {
  const id = await t.ctx.mailer.send({ kind: "digest", to: "quiet@thistledown.test", subject: "s", text: "t" });
  const quiet = workerTo((silent.address() as net.AddressInfo).port, 500);
  await expect(quiet.deliver(id, false)).rejects.toThrow();
  const [row] = await t.ctx.db.select().from(outgoingMail).where(eq(outgoingMail.id, id));
  expect(row).toMatchObject({ state: "queued", attempts: 1, lastError: "The mail server did not answer in time." });
  await drainMail(t);
});

it("two workers delivering one message at once send it once", async () => {
  const id = await t.ctx.mailer.send({ kind: "digest", to: "twice@thistledown.test", subject: "once", text: "t" });
  const other = workerTo(t.smtp.port);
  const results = await Promise.all([t.ctx.mailer.deliver(id, false), other.deliver(id, false)]);
  expect(results.sort()).toEqual(["sent", "skipped"]);
  expect(await mailsTo("twice@thistledown.test")).toHaveLength(1);
});

it("a second invite of an address whose invitation was sent gives it a fresh link: the old one stops working", async () => {
  const owner = await signIn(t.app, co.people.owner);
  const email = "fen.marsh@thistledown.test";
  const first = await owner.post("/api/team/invitations", { email, role: "engineer" });
  await drainMail(t);
  const oldToken = (await mailsTo(email))[0].text.match(/\/invite\/([A-Za-z0-9_-]+)/)![1];
  const again = await owner.post(`/api/team/invitations/${first.body.id}/resend`);
  expect(again.status).toBe(200);
  expect(again.body.id).toBe(first.body.id);
  await drainMail(t);
  const mails = await mailsTo(email);
  expect(mails).toHaveLength(2);
  const newToken = mails.map((m) => m.text.match(/\/invite\/([A-Za-z0-9_-]+)/)![1]).find((x) => x !== oldToken);
  expect(newToken).toBeTruthy();
  const guest = await signIn(t.app, co.people.technician);
  expect((await guest.get(`/api/invitations/${oldToken}`)).status).toBe(404);
  expect((await guest.get(`/api/invitations/${newToken}`)).status).toBe(200);
  expect(await t.ctx.db.select().from(invitations).where(eq(invitations.email, email))).toHaveLength(1);
});
