import { z } from "zod";
import { mailDelivery } from "./mail-delivery";
import { text } from "./text";

export const sendReportInput = z
  .object({
    /** Send to every store contact named on the sweep's store. */
    storeContacts: z.boolean("must be true or false").default(false),
    /** Any other addresses; recipients need no account. */
    addresses: z
      .array(
        z.email({
          // Name the address, so a sender with a list of ten sees which one to fix.
          error: (issue) =>
            typeof issue.input === "string" && issue.input.length > 0
              ? `“${issue.input.length > 80 ? `${issue.input.slice(0, 80)}…` : issue.input}” is not an e-mail address`
              : "must be an e-mail address",
        }),
        "must be a list of e-mail addresses",
      )
      .max(20, "must name at most 20 addresses")
      .default([]),
    message: text("must be text").trim().max(2000, "must be at most 2,000 characters").default(""),
  })
  .refine((v) => v.storeContacts || v.addresses.length > 0, {
    path: ["addresses"],
    message: "name at least one recipient, or send to the store contacts",
  });
export type SendReportInput = z.input<typeof sendReportInput>;

export const reportSend = z.object({
  id: z.uuid(),
  sweepId: z.uuid(),
  sentBy: text().nullable(),
  recipients: z.array(text()),
  subject: text(),
  filename: text(),
  /** The PDF's size; null until the job has made it (`delivery.state` "preparing"). */
  bytes: z.number().nullable(),
  /** When the sender pressed Send (the send is recorded then; `delivery` says when it went). */
  sentAt: text(),
  /** Null for sends recorded before mail went through the queue. */
  delivery: mailDelivery.nullable(),
});
export type ReportSend = z.infer<typeof reportSend>;

export const reportRecipient = z.object({ name: text(), email: text() });
export type ReportRecipient = z.infer<typeof reportRecipient>;
