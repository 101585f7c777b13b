import { QueryClient } from "@tanstack/react-query";
import { describe, expect, it } from "vitest";
import { findingsKeys } from "./findings/findings-keys";
import { invalidateEntity } from "./invalidate";
import { fixturesKeys, plansKeys } from "./plans/plans-keys";
import { recordsKeys } from "./records/records-keys";
import { storesKeys } from "./stores/stores-keys";
import { sweepsKeys } from "./sweeps/sweeps-keys";

function cacheWithEverything() {
  const qc = new QueryClient();
  const keys = {
    storeList: storesKeys.list(),
    storePage: storesKeys.detail("s1"),
    plans: plansKeys.list("s1"),
    fixtures: fixturesKeys.list("p1"),
    sweep: sweepsKeys.detail("w1"),
    analysis: sweepsKeys.analysis("w1", null),
    sweepSummary: sweepsKeys.summary("s1"),
    storeFindings: findingsKeys.list("s1"),
    systemFindings: findingsKeys.list("s1", "sys1"),
    finding: findingsKeys.detail("f1"),
    today: recordsKeys.today(),
    todayOfStore: recordsKeys.today("s1"),
    systemRecords: recordsKeys.system("sys1"),
  };
  for (const key of Object.values(keys)) qc.setQueryData(key, { cached: true });
  const stale = () =>
    Object.entries(keys)
      .filter(([, key]) => qc.getQueryState(key)?.isInvalidated)
      .map(([name]) => name)
      .sort();
  return { qc, stale };
}

describe("invalidation by entity", () => {
  it("a finding changed anywhere makes every findings list, Today, the system's records and the store's sweep summary stale", async () => {
    const { qc, stale } = cacheWithEverything();
    await invalidateEntity(qc, "finding");
    expect(stale()).toEqual(
      ["finding", "storeFindings", "systemFindings", "systemRecords", "sweepSummary", "today", "todayOfStore"].sort(),
    );
  });

  it("saved fixtures leave the fixtures themselves (written from the answer) and sweeps alone", async () => {
    const { qc, stale } = cacheWithEverything();
    await invalidateEntity(qc, "fixtures");
    expect(stale()).toEqual(["plans", "storePage"]);
  });

  it("a reviewed sweep refreshes sweeps, their analyses and the store's sweep summary, nothing of the records", async () => {
    const { qc, stale } = cacheWithEverything();
    await invalidateEntity(qc, "sweep");
    expect(stale()).toEqual(["analysis", "sweep", "sweepSummary"]);
  });
});
