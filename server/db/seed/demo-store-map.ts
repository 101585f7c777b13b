import { randomUUID } from "node:crypto";
import type { AppContext } from "../../context";
import { validateFixtureList } from "#core/contracts/fixtures";
import { KG_PER_POUND } from "#core/domain/units/mass";
import { uploadsStorage } from "../../storage/uploads-storage";
import { fixtureToRow } from "../plans/plan-rows";
import type { DbOrTx } from "../tx";
import { addPlanVersion, insertFixtureRows } from "../plans/plan-versions";
import { systems } from "../schema/index";
import { DEMO_PLAN, DEMO_SYSTEMS, demoFixtures, type DemoSystemKey } from "./demo-layout";
import { drawDemoPlan } from "./demo-plan-image";

/**
 * Maps the demo store completely: three systems, a calibrated floor drawing and about forty
 * fixtures linked to the systems. Runs inside the demo seed's transaction; the image files are
 * written first and removed again if the transaction fails.
 */
export async function seedDemoLayout(
  ctx: AppContext,
  tx: DbOrTx,
  ids: { companyId: string; storeId: string; createdById: string | null },
): Promise<void> {
  const systemIds = {} as Record<DemoSystemKey, string>;
  for (const s of DEMO_SYSTEMS) {
    const [row] = await tx
      .insert(systems)
      .values({
        companyId: ids.companyId,
        storeId: ids.storeId,
        name: s.name,
        refrigerantId: s.refrigerantId,
        fullChargeKg: s.fullChargeLb * KG_PER_POUND, // 0.45359237 kg/lb exactly (NIST SP 811)
        applianceType: "commercial-refrigeration",
        automaticLeakDetection: s.automaticLeakDetection,
      })
      .returning();
    systemIds[s.key] = row.id;
  }

  const fixtures = demoFixtures(systemIds);
  // The demo must pass the same checks a lead tech's save does.
  const checked = validateFixtureList(fixtures, { width: DEMO_PLAN.widthM, height: DEMO_PLAN.heightM });
  if (!checked.ok)
    throw new Error(`demo layout is invalid: ${checked.errors.map((e) => `${e.path} ${e.message}`).join("; ")}`);

  const drawing = await drawDemoPlan(fixtures);
  const planId = randomUUID();
  const prefix = `plans/${ids.companyId}/${planId}`;
  const keys = { original: `${prefix}/original.png`, display: `${prefix}/display.png`, thumb: `${prefix}/thumb.png` };
  const storage = uploadsStorage(ctx);
  const written: string[] = [];
  try {
    for (const [key, data] of [
      [keys.original, drawing.png],
      [keys.display, drawing.png],
      [keys.thumb, drawing.thumb],
    ] as const) {
      await storage.put(key, data);
      written.push(key);
    }
    // Calibrated as a lead tech would: a line along the front wall, 1180 px, typed as 59 m.
    const line = {
      a: { x: 10, y: drawing.heightPx - 10 },
      b: { x: drawing.widthPx - 10, y: drawing.heightPx - 10 },
      length: { value: 59, unit: "m" as const },
    };
    const mpp = line.length.value / (line.b.x - line.a.x);
    const plan = await addPlanVersion(
      tx,
      {
        companyId: ids.companyId,
        storeId: ids.storeId,
        source: "image",
        originalKey: keys.original,
        displayKey: keys.display,
        thumbKey: keys.thumb,
        originalMime: "image/png",
        originalWidthPx: drawing.widthPx,
        originalHeightPx: drawing.heightPx,
        imageWidthPx: drawing.widthPx,
        imageHeightPx: drawing.heightPx,
        metresPerPixel: mpp,
        calibration: line,
        widthM: drawing.widthPx * mpp,
        heightM: drawing.heightPx * mpp,
        createdById: ids.createdById,
      },
      { id: planId },
    );
    await insertFixtureRows(
      tx,
      checked.fixtures.map((f, i) => fixtureToRow(plan.id, f, i)),
    );
  } catch (err) {
    await Promise.allSettled(written.map((k) => storage.delete(k)));
    throw err;
  }
}
