import nodemailer, { type Transporter } from "nodemailer";

export interface MailAttachment {
  filename: string;
  content: Buffer;
  contentType: string;
}

export interface OutgoingMail {
  to: string | string[];
  subject: string;
  text: string;
  html?: string;
  attachments?: MailAttachment[];
  /** Lets the Outbox show a company only its own mail. */
  companyId?: string | null;
  /** Stable Message-ID, so a receiver can drop a copy sent twice after a crash mid-send. */
  messageId?: string;
}

/** Sends one message now: the SMTP transport behind the outgoing queue (server/mail/mail-queue.ts). */
export interface MailTransport {
  send(mail: OutgoingMail): Promise<void>;
  close(): void;
}

export interface SmtpSettings {
  host: string;
  port: number;
  secure: boolean;
  user?: string;
  pass?: string;
  from: string;
  /** Connect, greeting and idle-socket limit: a server that never answers fails the attempt quickly. */
  timeoutMs?: number;
}

export const SMTP_TIMEOUT_MS = 10_000;

/** Sends through any SMTP server: the built-in fake in the demo and tests, a real host in production. */
export function createSmtpMailer(settings: SmtpSettings, isFake: boolean): MailTransport {
  const timeout = settings.timeoutMs ?? SMTP_TIMEOUT_MS;
  const transport: Transporter = nodemailer.createTransport({
    host: settings.host,
    port: settings.port,
    secure: settings.secure,
    // The fake server speaks plain SMTP on loopback (its bundled certificate has expired).
    ignoreTLS: isFake,
    auth: settings.user ? { user: settings.user, pass: settings.pass ?? "" } : undefined,
    // nodemailer's defaults wait 2 min to connect and 10 min on a silent socket.
    connectionTimeout: timeout,
    greetingTimeout: timeout,
    socketTimeout: timeout * 3,
  });
  return {
    async send(mail) {
      await transport.sendMail({
        from: settings.from,
        to: mail.to,
        subject: mail.subject,
        text: mail.text,
        html: mail.html,
        attachments: mail.attachments,
        messageId: mail.messageId,
        // Read back by the fake server to file the message under its company.
        headers: mail.companyId ? { "X-Plumeline-Company": mail.companyId } : undefined,
      });
    },
    close() {
      transport.close();
    },
  };
}
