import { execFileSync } from "node:child_process";
import { mkdirSync, mkdtempSync, readdirSync, renameSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";

const ARTEFACTS = path.resolve(import.meta.dirname, "../../test-results/pdf");

/**
 * Renders every page of a PDF to PNG with Debian's poppler-utils (pdftoppm) into
 * test-results/pdf/<name>-<page>.png, for a person to look at after the run. Returns the files.
 */
export function renderPdfPages(bytes: Uint8Array, name: string, dpi = 60): string[] {
  mkdirSync(ARTEFACTS, { recursive: true });
  const work = mkdtempSync(path.join(tmpdir(), "plumeline-pdf-"));
  try {
    const pdf = path.join(work, "doc.pdf");
    writeFileSync(pdf, bytes);
    execFileSync("pdftoppm", ["-png", "-r", String(dpi), pdf, path.join(work, "page")]);
    for (const old of readdirSync(ARTEFACTS).filter((f) => f.startsWith(`${name}-`))) rmSync(path.join(ARTEFACTS, old));
    return readdirSync(work)
      .filter((f) => f.endsWith(".png"))
      .sort()
      .map((f) => {
        const page = Number(/(\d+)\.png$/.exec(f)![1]);
        const to = path.join(ARTEFACTS, `${name}-${page}.png`);
        renameSync(path.join(work, f), to);
        return to;
      });
  } finally {
    rmSync(work, { recursive: true, force: true });
  }
}
