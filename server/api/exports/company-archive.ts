import type { Writable } from "node:stream";
import { ZipFile } from "yazl";
import type { AppContext } from "../../context";
import type { Viewer } from "../../access/store-access";
import { tableCsv } from "#core/domain/reports/table-csv";
import { HttpError } from "../../lib/http-error";
import { getSystemRecords } from "../compliance/records.service";
import { listFindings } from "../findings/findings.service";
import { listRevisions } from "../systems/system-revisions.service";
import type { ReaderUnits } from "../reports/reader-units";
import { sweepReportPdf } from "../reports/reports.service";
import { archiveTables, type ArchiveTable } from "./archive-tables";
import { leakRateStatementPdf } from "./leak-rate-statement";
import { statementSettings, type StatementSettings } from "./statement-settings";

const slug = (s: string) =>
  s
    .normalize("NFKD")
    // The accents NFKD splits off go, the letters stay: "Getränkekühler" → "getrankekuhler".
    .replace(/\p{M}+/gu, "")
    .replace(/[^\w]+/g, "-")
    .replace(/^-|-$/g, "")
    .toLowerCase() || "x";

/** What the archive holds and how its statements print, read before the first byte is sent so a failed read is still a clean error. */
export interface LoadedArchive {
  tables: ArchiveTable[];
  settings: StatementSettings;
}

export async function loadArchive(ctx: AppContext, viewer: Viewer): Promise<LoadedArchive> {
  // The company's rules are read once: for which tables there are and for every statement.
  const settings = await statementSettings(ctx, viewer.companyId);
  return { tables: await archiveTables(ctx, viewer.companyId, settings.rules.profile), settings };
}

/**
 * Writes the owner's archive as a zip stream: one CSV per table of records, then the leak-rate
 * statement of every system (retired ones too) and the report of every submitted sweep, each
 * built one at a time as it is written so memory holds one PDF, not all. A PDF that cannot be made
 * (an expected refusal, such as a sweep without readings) is listed in README.txt with its reason
 * instead; any other failure ends the stream, which the client sees as a broken download.
 */
export async function writeArchive(
  ctx: AppContext,
  viewer: Viewer,
  { tables, settings }: LoadedArchive,
  units: ReaderUnits,
  out: Writable,
  now = new Date(),
): Promise<void> {
  const zip = new ZipFile();
  const finished = new Promise<void>((resolve, reject) => {
    out.on("finish", resolve);
    out.on("close", resolve);
    out.on("error", reject);
    zip.outputStream.on("error", reject);
  });
  zip.outputStream.pipe(out);
  const mtime = now;
  const listed: string[] = [];
  const skipped: string[] = [];
  for (const t of tables) {
    zip.addBuffer(Buffer.from(tableCsv(t.columns, t.rows, t.instants), "utf8"), `tables/${t.file}`, { mtime });
    listed.push(`tables/${t.file} (${t.rows.length} rows)`);
  }

  const statement = { ...settings.statement, generatedAt: now };
  const systems = tables.find((t) => t.file === "systems.csv")?.rows ?? [];
  for (const s of systems as { id: string; name: string; storeId: string }[]) {
    const name = `statements/${slug(s.name)}-${s.id.slice(0, 8)}.pdf`;
    try {
      const records = await getSystemRecords(ctx, viewer, s.id, now, settings.rules);
      const list = await listFindings(ctx, viewer, s.storeId, { systemId: s.id });
      const revisions = await listRevisions(ctx, viewer, s.id);
      zip.addBuffer(await leakRateStatementPdf(records, list, statement, revisions), name, { mtime });
      listed.push(name);
    } catch (err) {
      if (!(err instanceof HttpError)) throw err;
      skipped.push(`${name}: ${err.message}`);
    }
  }

  const sweepRows = tables.find((t) => t.file === "sweeps.csv")?.rows ?? [];
  for (const sw of sweepRows as { id: string; status: string }[]) {
    if (sw.status === "in-progress") continue; // a sweep still being walked has no report yet
    try {
      const { filename, pdf } = await sweepReportPdf(ctx, viewer, sw.id, units);
      const name = `sweep-reports/${filename.replace(/\.pdf$/, "")}-${sw.id.slice(0, 8)}.pdf`;
      zip.addBuffer(pdf, name, { mtime });
      listed.push(name);
    } catch (err) {
      if (!(err instanceof HttpError)) throw err;
      skipped.push(`sweep ${sw.id}: ${err.message}`);
    }
  }

  const readme = [
    `Plumeline record set, written ${now.toISOString()}.`,
    "Each CSV under tables/ is one table of records as stored: column names as in the database,",
    "instants in ISO 8601 UTC (their columns end in _utc), days as YYYY-MM-DD, masses in kg,",
    "people by id (see people.csv). The leak-rate statements write times in each store's zone.",
    "Text that a spreadsheet could run as a formula starts with a ' (OWASP CSV injection guidance).",
    "",
    "Contents:",
    ...listed.map((l) => `  ${l}`),
    ...(skipped.length ? ["", "Not included, with the reason:", ...skipped.map((l) => `  ${l}`)] : []),
    "",
  ].join("\r\n");
  zip.addBuffer(Buffer.from(readme, "utf8"), "README.txt", { mtime });
  zip.end();
  await finished;
}
