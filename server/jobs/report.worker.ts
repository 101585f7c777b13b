/** Draws the report's field map (jimp) and lays out the PDF (pdfkit) on the CPU pool: about a second of CPU. */
import { CONCENTRATION_LUT, createConcentrationScale } from "#core/domain/fieldmap/concentration-ramp";
import type { FieldGridLike } from "#core/domain/fieldmap/field-grid";
import type { SweepReportModel } from "#core/domain/reports/sweep-report-model";
import { renderFieldMapPng } from "../reports/field-map-png";
import { buildSweepReportPdf } from "../reports/sweep-report-pdf";
import { workerTask } from "./worker-task";

export interface ReportJob {
  model: SweepReportModel;
  map: {
    planImage: Uint8Array | null;
    widthM: number;
    heightM: number;
    field: FieldGridLike;
    maxPpm: number;
    outlines: [number, number][][];
    legend: string;
  } | null;
}

export default workerTask<ReportJob, Uint8Array>(
  async ({ model, map }) => {
    if (map) {
      const scale = createConcentrationScale({ maxPpm: map.maxPpm, log: true });
      const png = await renderFieldMapPng({
        planImage: map.planImage
          ? Buffer.from(map.planImage.buffer, map.planImage.byteOffset, map.planImage.byteLength)
          : null,
        widthM: map.widthM,
        heightM: map.heightM,
        field: map.field,
        lut: CONCENTRATION_LUT,
        index: scale.index,
        outlines: map.outlines,
        spots: model.suspects,
        widthPx: 1400,
      });
      model.map = { png, widthM: map.widthM, heightM: map.heightM, legend: map.legend };
    }
    const pdf = await buildSweepReportPdf(model);
    return new Uint8Array(pdf.buffer, pdf.byteOffset, pdf.byteLength);
  },
  { transferables: (r) => [r.buffer as ArrayBuffer] },
);
