/**
 * Technicians syncing readings the way the Walk client does: a batch is resent after any 5xx,
 * network error or refused connection (only a 4xx other than 401 would be a permanent refusal) until
 * it is acknowledged. Counts what was sent, acknowledged and answered, for fault tests.
 */
import { randomUUID } from "node:crypto";
import type { HttpSession } from "./http-session";

export interface BurstStats {
  batchesSent: number;
  attempts: number;
  sentIds: Set<string>;
  acknowledged: Set<string>;
  /** status code (or "network") → how many answers */
  answers: Map<number | "network", number>;
  /** 503 answers that carried a Retry-After header and a JSON error body */
  wellFormed503: number;
  /** batches given up at the hard deadline (should stay 0) */
  abandoned: number;
}

export function newStats(): BurstStats {
  return {
    batchesSent: 0,
    attempts: 0,
    sentIds: new Set(),
    acknowledged: new Set(),
    answers: new Map(),
    wellFormed503: 0,
    abandoned: 0,
  };
}

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

export interface BurstOptions {
  session: HttpSession;
  sweepId: string;
  startedAt: Date;
  clients: number;
  batchSize: number;
  /** New batches stop once this returns true; a batch already started is still seen through. */
  stop: () => boolean;
  /** Hard limit for resending one batch (ms since epoch). */
  giveUpAt: () => number;
  /** Pause between retries (the Walk client waits seconds; tests keep it short). */
  retryMs?: number;
  stats?: BurstStats;
}

export async function runSyncBurst(o: BurstOptions): Promise<BurstStats> {
  const stats = o.stats ?? newStats();
  const count = (k: number | "network") => stats.answers.set(k, (stats.answers.get(k) ?? 0) + 1);
  let n = 0;
  const client = async () => {
    while (!o.stop()) {
      const readings = Array.from({ length: o.batchSize }, () => {
        const i = n++;
        return {
          id: randomUUID(),
          x: 1 + (i % 70) * 0.5,
          y: 1 + (Math.floor(i / 70) % 20),
          takenAt: new Date(o.startedAt.getTime() + 1000 + (i % 3000) * 100).toISOString(),
          ppm: i % 7,
          samplePoint: "grille",
        };
      });
      for (const r of readings) stats.sentIds.add(r.id);
      stats.batchesSent++;
      for (;;) {
        stats.attempts++;
        let res: Response | null = null;
        try {
          res = await o.session.request("POST", `/api/sweeps/${o.sweepId}/readings`, { readings });
        } catch {
          count("network");
        }
        if (res) {
          count(res.status);
          if (res.status === 200) {
            const body = await res.json();
            if (body.rejected.length) throw new Error(`readings refused: ${JSON.stringify(body.rejected[0])}`);
            for (const r of readings) stats.acknowledged.add(r.id);
            break;
          }
          const text = await res.text();
          if (res.status === 503 && res.headers.get("retry-after") && JSON.parse(text).error?.code)
            stats.wellFormed503++;
          if (res.status < 500 && res.status !== 401)
            throw new Error(`a permanent refusal (${res.status}) the Walk client would drop: ${text}`);
        }
        if (Date.now() > o.giveUpAt()) {
          stats.abandoned++;
          break;
        }
        await sleep(o.retryMs ?? 200);
      }
    }
  };
  await Promise.all(Array.from({ length: o.clients }, client));
  return stats;
}

export function describeStats(s: BurstStats): string {
  const answers = [...s.answers].map(([k, v]) => `${k}×${v}`).join(" ");
  return `${s.sentIds.size} sent, ${s.acknowledged.size} acknowledged in ${s.batchesSent} batches (${s.attempts} requests: ${answers}), ${s.abandoned} abandoned`;
}

/**
 * The fault tests' burst: six technicians' devices sending 25-reading batches until `finish()`,
 * each batch given up after 90 s. `stats` fills as answers arrive; `finish()` waits for the last batch.
 */
export function startBurst(f: { tech: HttpSession; sweepId: string; startedAt: Date }) {
  let stopping = false;
  const stats = newStats();
  const hardStop = Date.now() + 90_000;
  const burst = runSyncBurst({
    session: f.tech,
    sweepId: f.sweepId,
    startedAt: f.startedAt,
    clients: 6,
    batchSize: 25,
    stop: () => stopping,
    giveUpAt: () => hardStop,
    stats,
  });
  return {
    stats,
    finish(): Promise<BurstStats> {
      stopping = true;
      return burst;
    },
  };
}
