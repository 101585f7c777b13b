/** The sweep report's PDF and its file name, shared by the download and the report e-mail's job. */
import type { AppContext } from "../../context";
import { createConcentrationScale } from "#core/domain/fieldmap/concentration-ramp";
import { formatQuantity } from "#core/domain/numbers/number-format";
import { createReportRunner } from "../../jobs/report-runner";
import type { ReportJob } from "../../jobs/report.worker";
import { uploadsStorage } from "../../storage/uploads-storage";
import type { ReportFacts } from "./report-facts";

const slug = (s: string) =>
  s
    .normalize("NFKD")
    .replace(/[^\w]+/g, "-")
    .replace(/^-|-$/g, "")
    .toLowerCase();

/** `sweep-<store>-<day the sweep started, in the store's zone>`. */
export function reportFileBase(storeName: string, timeZone: string, startedAt: Date): string {
  const day = new Intl.DateTimeFormat("sv-SE", { timeZone }).format(startedAt);
  return `sweep-${slug(storeName)}-${day}`;
}

/** The PDF, drawn and laid out in a worker thread so the event loop keeps answering meanwhile. */
export async function buildReportPdf(ctx: AppContext, f: ReportFacts): Promise<Buffer> {
  let map: ReportJob["map"] = null;
  if (f.field) {
    const scale = createConcentrationScale({ maxPpm: f.maxPpm, log: true });
    const ppm = (v: number) => formatQuantity(v, f.numbers);
    const planImage = f.planImage.displayKey ? await uploadsStorage(ctx).get(f.planImage.displayKey) : null;
    map = {
      planImage: planImage ? new Uint8Array(planImage) : null,
      widthM: f.planImage.widthM,
      heightM: f.planImage.heightM,
      field: f.field,
      maxPpm: f.maxPpm,
      outlines: f.outlines,
      // Ticks apart by semicolons: a comma is the decimal mark in some number formats.
      legend: `Colour: lag-corrected concentration on a log scale from 0 (pale sand) to ${ppm(f.maxPpm)} ppm (deep plum); ${scale.ticks().map(ppm).join("; ")} ppm. Hatched or clear: not sampled enough to say — unknown, not clean. Numbered rings: suspect spots with their search radius.`,
    };
  }
  ctx.reportRunner ??= createReportRunner();
  const bytes = await ctx.reportRunner.run({ model: f.model, map });
  return Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength);
}
