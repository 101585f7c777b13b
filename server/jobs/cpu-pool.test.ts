import { afterEach, describe, expect, it } from "vitest";
import bcrypt from "bcryptjs";
import { createCpuPool, CpuBusyError, CpuTimeoutError, type CpuPool } from "./cpu-pool";
import type { PasswordTask } from "./password.worker";

// The pool is tested with password tasks: bcryptjs on the main thread is the reference that checks
// what the worker computed, and a high cost is a task that is certain to run for seconds.
let pool: CpuPool | null = null;
afterEach(async () => {
  await pool?.close();
  pool = null;
});

const hash = (p: CpuPool, password: string, cost: number, timeoutMs?: number) =>
  p.run<PasswordTask, string>("password", { op: "hash", password, cost }, { timeoutMs });

describe("the CPU pool", () => {
  it("hashes and compares passwords in a worker thread, as bcryptjs does on the main thread", async () => {
    pool = createCpuPool({ maxThreads: 1 });
    const h = await hash(pool, "correct horse battery staple", 5);
    expect(bcrypt.getRounds(h)).toBe(5);
    expect(bcrypt.compareSync("correct horse battery staple", h)).toBe(true);
    const reference = bcrypt.hashSync("tr0ub4dor&3", 4);
    expect(await pool.run("password", { op: "compare", password: "tr0ub4dor&3", hash: reference })).toBe(true);
    expect(await pool.run("password", { op: "compare", password: "tr0ub4dor&4", hash: reference })).toBe(false);
    expect(pool.load).toBe(0);
  });

  it("stops a task past its time limit and goes on serving with a new worker", async () => {
    pool = createCpuPool({ maxThreads: 1 });
    // cost 20 is 2^20 rounds of bcrypt's key schedule: minutes of CPU, far past a 300 ms limit
    const slow = hash(pool, "never finishes", 20, 300);
    await expect(slow).rejects.toBeInstanceOf(CpuTimeoutError);
    await expect(slow).rejects.toThrow(/password task took longer than 300 ms/);
    expect(bcrypt.getRounds(await hash(pool, "after the timeout", 4))).toBe(4);
  });

  it("refuses a task when the queue is full with an error that answers 503 and Retry-After", async () => {
    pool = createCpuPool({ maxThreads: 1, maxQueue: 1 });
    const long = [hash(pool, "first", 20), hash(pool, "second", 20)];
    for (const p of long) p.catch(() => {}); // ended by close() below
    const third = hash(pool, "third", 4);
    await expect(third).rejects.toBeInstanceOf(CpuBusyError);
    const err = await third.catch((e: CpuBusyError) => e);
    expect(err).toMatchObject({ status: 503, code: "busy", details: { retryAfterSeconds: 5 } });
    expect(pool.load).toBe(2);
    await pool.close();
    for (const p of long) await expect(p).rejects.toThrow();
    pool = null;
  });

  it("refuses a pool without workers", () => {
    expect(() => createCpuPool({ maxThreads: 0 })).toThrow(/maxThreads: must be a whole number of workers, at least 1/);
  });
});
