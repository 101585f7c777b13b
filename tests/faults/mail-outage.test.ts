// Fault test: the mail server down, then up. The app (a child process with its job-queue worker)
// runs on a cluster of its own and sends to an SMTP server this test starts and stops; loopback only.
import { afterAll, beforeAll, expect, it } from "vitest";
import pg from "pg";
import { createDb } from "../../server/db/client";
import { startFakeSmtp, type FakeSmtp } from "../../server/mail/fake-smtp";
import { freePort, startOwnCluster, type OwnCluster } from "../helpers/own-cluster";
import { faultFixture, type FaultFixture } from "../helpers/fault-fixture";

let cluster: OwnCluster;
let f: FaultFixture;
let smtpPort: number;
let smtp: FakeSmtp | null = null;
let db: ReturnType<typeof createDb>;
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

beforeAll(async () => {
  cluster = await startOwnCluster("fault-mail");
  smtpPort = await freePort();
  f = await faultFixture(cluster, {
    SMTP_HOST: "127.0.0.1",
    SMTP_PORT: String(smtpPort),
    SMTP_TIMEOUT_MS: "2000",
    MAIL_RETRY_DELAY_S: "1",
    MAIL_RETRY_LIMIT: "10",
    JOB_POLL_INTERVAL_S: "0.5",
  });
  db = createDb(f.databaseUrl);
}, 120_000);

afterAll(async () => {
  await smtp?.close();
  await db?.pool.end();
  if (f?.app.alive()) {
    f.app.kill("SIGKILL");
    await f.app.exited;
  }
  await cluster?.destroy();
}, 60_000);

async function caughtTo(email: string): Promise<number> {
  const c = new pg.Client({ connectionString: f.databaseUrl });
  await c.connect();
  try {
    const { rows } = await c.query('select count(*)::int as n from outbox_messages where $1 = any("to")', [email]);
    return rows[0].n;
  } finally {
    await c.end();
  }
}

async function deliveryOf(invitationId: string) {
  const team = await (await f.owner.request("GET", "/api/team")).json();
  return team.invitations.find((i: { id: string }) => i.id === invitationId).delivery;
}

it("mail server down then up: the invitation succeeds at once, shows why it waits, and is sent exactly once when the server is back", async () => {
  const email = "briar.holt@tamarack.test";
  const invited = await f.owner.request("POST", "/api/team/invitations", { email, role: "technician" });
  expect(invited.status).toBe(201);
  const invitation = await invited.json();

  // Down: tries fail and the owner sees the reason while it waits.
  const by = Date.now() + 30_000;
  let delivery = await deliveryOf(invitation.id);
  while (delivery.attempts < 2) {
    if (Date.now() > by) throw new Error(`no retry within 30 s: ${JSON.stringify(delivery)}\n${f.app.output()}`);
    await sleep(250);
    delivery = await deliveryOf(invitation.id);
  }
  expect(delivery).toMatchObject({ state: "queued", error: "The mail server could not be reached." });
  const triesWhileDown = delivery.attempts;

  // Up: the next retry delivers it.
  smtp = await startFakeSmtp(db.db, smtpPort);
  const sentBy = Date.now() + 60_000;
  while ((delivery = await deliveryOf(invitation.id)).state !== "sent") {
    if (Date.now() > sentBy) throw new Error(`not sent 60 s after the server came back: ${JSON.stringify(delivery)}`);
    await sleep(250);
  }
  await sleep(2_500); // a few more polls: nothing is sent twice
  const copies = await caughtTo(email);
  console.log(
    `mail outage: ${triesWhileDown} failed tries while down, sent on try ${delivery.attempts}, ${copies} message(s) received`,
  );
  expect(copies).toBe(1);
  expect(delivery.error).toBeNull();
  expect(f.app.alive()).toBe(true);
}, 120_000);
