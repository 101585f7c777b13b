import type { Db } from "../client";
import { detectors } from "../schema/index";

type Tx = Parameters<Parameters<Db["transaction"]>[0]>[0];

/** The demo company's two detectors (invented instruments): one checked recently, one overdue. */
export async function seedDemoDetectors(tx: Tx, companyId: string, today = new Date()): Promise<void> {
  const daysAgo = (n: number) => new Date(today.getTime() - n * 86_400_000).toISOString().slice(0, 10);
  await tx.insert(detectors).values([
    // 5 s transport delay and 2 ppm alarm: common practice for a hose-sampling detector, no published source.
    { companyId, name: "Van 2 heated-diode sniffer", principle: "heated-diode", transportDelayS: 5, timeConstantS: 1.5, alarmPpm: 2, lastCheckedOn: daysAgo(6) },
    { companyId, name: "Shop infrared sniffer", principle: "infrared", transportDelayS: 4, timeConstantS: 2, alarmPpm: 3, lastCheckedOn: daysAgo(45) },
  ]);
}
