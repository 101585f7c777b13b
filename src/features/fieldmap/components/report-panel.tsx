import { useState } from "react";
import { Alert } from "../../../components/ui/alert";
import { Button } from "../../../components/ui/button";
import { Checkbox } from "../../../components/ui/checkbox";
import { TextField } from "../../../components/ui/text-field";
import { isApiRequestError } from "../../../lib/api-client";
import { MailDeliveryStatus } from "../../../components/mail-delivery-status";
import { useReportRecipients, useReportSends, useRetryReportSend, useSendReport } from "../api/reports";
import { PdfDownload } from "./pdf-download";

/** Download the PDF or the readings CSV; e-mail the PDF to the store contact or anyone typed in. */
export function ReportPanel({
  sweepId,
  canSend,
  zoned,
}: {
  sweepId: string;
  canSend: boolean;
  zoned(iso: string): string;
}) {
  const sends = useReportSends(sweepId);
  const contacts = useReportRecipients(sweepId, canSend);
  const send = useSendReport(sweepId);
  const retry = useRetryReportSend(sweepId);
  const [toContacts, setToContacts] = useState(true);
  const [addresses, setAddresses] = useState("");
  const [message, setMessage] = useState("");
  const fields = send.error && isApiRequestError(send.error) ? send.error.fields : {};
  // One message per bad address ("“x@” is not an e-mail address"), all of them, not only the first.
  const addressError =
    Object.entries(fields)
      .filter(([k]) => k.startsWith("addresses"))
      .map(([, m]) => m)
      .join("; ") || undefined;
  return (
    <div className="space-y-3">
      <div className="flex flex-wrap items-start gap-2">
        <PdfDownload
          href={`/api/sweeps/${sweepId}/report.pdf`}
          label="Download the PDF report"
          fallbackName="sweep-report.pdf"
        />
        <a
          className="inline-flex min-h-11 items-center rounded-md edge bg-surface px-4 font-bold no-underline"
          href={`/api/sweeps/${sweepId}/readings.csv`}
          download
        >
          Readings as CSV
        </a>
      </div>
      {canSend ? (
        <form
          className="space-y-2 rounded-md edge bg-surface p-3"
          aria-label="E-mail the report"
          onSubmit={(e) => {
            e.preventDefault();
            const list = addresses.split(/[\s,;]+/).filter(Boolean);
            send.mutate({ storeContacts: toContacts && (contacts.data?.length ?? 0) > 0, addresses: list, message });
          }}
        >
          <p className="font-bold">E-mail the report</p>
          <Checkbox
            label={
              contacts.data?.length
                ? `The store contact: ${contacts.data.map((c) => `${c.name} <${c.email}>`).join(", ")}`
                : "The store contact (this store has none yet)"
            }
            checked={toContacts && (contacts.data?.length ?? 0) > 0}
            disabled={!contacts.data?.length}
            onChange={(e) => setToContacts(e.currentTarget.checked)}
          />
          <TextField
            label="Other addresses"
            hint="Separate several with commas. Recipients need no account."
            value={addresses}
            onChange={(e) => setAddresses(e.currentTarget.value)}
            error={addressError}
          />
          <TextField label="Message (optional)" value={message} onChange={(e) => setMessage(e.currentTarget.value)} />
          <Button type="submit" busy={send.isPending}>
            Send the report
          </Button>
          {send.isSuccess ? (
            <Alert tone="success">
              Sending to {send.data.recipients.join(", ")}: the PDF is being made, then the e-mail goes out. Its
              progress shows under “Sent”.
            </Alert>
          ) : null}
          {send.isError && !addressError ? <Alert tone="error">{send.error.message}</Alert> : null}
        </form>
      ) : null}
      {sends.data?.length ? (
        <div>
          <p className="font-bold">Sent</p>
          {/* Polite live list: "Making the PDF", then "Queued", turning into "E-mail sent" (or why not) is announced. */}
          <ul className="text-sm" data-testid="report-sends" aria-live="polite">
            {sends.data.map((s) => (
              <li key={s.id}>
                {zoned(s.sentAt)}: {s.sentBy ?? "someone"} sent {s.filename} to {s.recipients.join(", ")}.{" "}
                <MailDeliveryStatus delivery={s.delivery} />
                {canSend && s.delivery?.state === "failed" ? (
                  <Button
                    variant="secondary"
                    className="ml-2"
                    busy={retry.isPending && retry.variables === s.id}
                    onClick={() => retry.mutate(s.id)}
                  >
                    Send again
                  </Button>
                ) : null}
              </li>
            ))}
          </ul>
        </div>
      ) : null}
    </div>
  );
}
