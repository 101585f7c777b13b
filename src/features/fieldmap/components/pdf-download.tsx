import { useState } from "react";
import { Button } from "../../../components/ui/button";
import { formatBytes } from "../../../lib/format";
import { toError } from "../../../lib/api-client";

type State =
  | { step: "idle" }
  | { step: "working" }
  | { step: "done"; bytes: number }
  | { step: "failed"; message: string };

/** The name the server gives the file (Content-Disposition), else a plain one. */
function fileName(disposition: string | null, fallback: string): string {
  const m = /filename="?([^";]+)"?/i.exec(disposition ?? "");
  return m ? m[1] : fallback;
}

/**
 * Downloads a document the server makes on request (the sweep's PDF report takes a few seconds):
 * the button says it is working and cannot be pressed twice, and a status region says when the
 * file is saved or why it failed. A plain link would show nothing until the browser's download starts.
 */
export function PdfDownload({ href, label, fallbackName }: { href: string; label: string; fallbackName: string }) {
  const [state, setState] = useState<State>({ step: "idle" });
  async function download() {
    if (state.step === "working") return;
    setState({ step: "working" });
    try {
      const response = await fetch(href, { credentials: "same-origin" });
      if (!response.ok) {
        const body = await response.json().catch(() => undefined);
        throw toError(response.status, body);
      }
      const blob = await response.blob();
      const url = URL.createObjectURL(blob);
      const a = document.createElement("a");
      a.href = url;
      a.download = fileName(response.headers.get("Content-Disposition"), fallbackName);
      document.body.append(a);
      a.click();
      a.remove();
      // Let the browser take the file before the address goes.
      setTimeout(() => URL.revokeObjectURL(url), 10_000);
      setState({ step: "done", bytes: blob.size });
    } catch (e) {
      setState({
        step: "failed",
        message: e instanceof Error ? e.message : "Plumeline could not reach the server. Try again.",
      });
    }
  }
  return (
    <div className="space-y-1">
      <Button variant="secondary" busy={state.step === "working"} onClick={() => void download()}>
        {label}
      </Button>
      <p role="status" aria-live="polite" className="text-sm" data-testid="pdf-download-status">
        {state.step === "working"
          ? "Making the PDF report… this takes a few seconds."
          : state.step === "done"
            ? `The PDF report is downloaded (${formatBytes(state.bytes)}).`
            : state.step === "failed"
              ? `The PDF report could not be made: ${state.message}`
              : ""}
      </p>
    </div>
  );
}
