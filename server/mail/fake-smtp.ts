import { SMTPServer } from "smtp-server";
import { simpleParser, type AddressObject } from "mailparser";
import type { AddressInfo } from "node:net";
import type { Db } from "../db/client";
import { outboxMessages } from "../db/schema/index";

export interface FakeSmtp {
  port: number;
  close(): Promise<void>;
}

function addresses(field: AddressObject | AddressObject[] | undefined): string[] {
  if (!field) return [];
  const list = Array.isArray(field) ? field : [field];
  return list.flatMap((a) => a.value.map((v) => v.address ?? "")).filter(Boolean);
}

/**
 * A real SMTP server on loopback that accepts everything and files each message in
 * outbox_messages, so the demo and tests can read invitations and reports that were "sent".
 */
export async function startFakeSmtp(db: Db, port: number, onStored?: () => void): Promise<FakeSmtp> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ["STARTTLS", "AUTH"],
    logger: false,
    size: 40 * 1024 * 1024,
    onData(stream, _session, callback) {
      const chunks: Buffer[] = [];
      stream.on("data", (c: Buffer) => chunks.push(c));
      stream.on("end", async () => {
        try {
          const raw = Buffer.concat(chunks);
          const parsed = await simpleParser(raw);
          const companyHeader = parsed.headers.get("x-plumeline-company");
          await db.insert(outboxMessages).values({
            companyId: typeof companyHeader === "string" ? companyHeader : null,
            from: addresses(parsed.from)[0] ?? "",
            to: [...addresses(parsed.to), ...addresses(parsed.cc)],
            subject: parsed.subject ?? "",
            text: parsed.text ?? "",
            html: typeof parsed.html === "string" ? parsed.html : null,
            attachments: parsed.attachments.map((a) => ({
              filename: a.filename ?? "attachment",
              contentType: a.contentType,
              size: a.size,
            })),
            rawSize: raw.length,
          });
          onStored?.();
          callback();
        } catch (err) {
          callback(err as Error);
        }
      });
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once("error", reject);
    server.listen(port, "127.0.0.1", () => resolve());
  });
  const actual = (server.server.address() as AddressInfo).port;
  return {
    port: actual,
    close: () => new Promise((resolve) => server.close(() => resolve())),
  };
}
