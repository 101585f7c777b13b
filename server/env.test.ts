import os from "node:os";
import { describe, expect, it } from "vitest";
import { readEnv } from "./env";

const base = { DATABASE_URL: "postgres://x@127.0.0.1/x" };

describe("the CPU pool, upload and pruning settings", () => {
  it("default to one worker per core, a bounded queue, one decode at a time and a year-plus log", () => {
    const env = readEnv(base);
    expect(env.CPU_WORKERS).toBe(os.availableParallelism());
    expect(env).toMatchObject({
      CPU_QUEUE_MAX: 100,
      CPU_TASK_TIMEOUT_MS: 120_000,
      CPU_WORKER_HEAP_MB: 512,
      CPU_WORKER_NICE: 0,
      DECODE_CONCURRENCY: 1,
      DECODE_QUEUE_MAX: 16,
      DECODE_WAIT_MS: 60_000,
      SECURITY_LOG_RETENTION_DAYS: 400,
      MAIL_SENT_RETENTION_DAYS: 90,
      MAIL_FAILED_RETENTION_DAYS: 365,
    });
  });

  it("refuses more workers than cores, no worker, and a security log kept less than a year and a day", () => {
    const cores = os.availableParallelism();
    expect(() => readEnv({ ...base, CPU_WORKERS: String(cores + 1) })).toThrow(
      new RegExp(`CPU_WORKERS: CPU_WORKERS must be at most ${cores}`),
    );
    expect(() => readEnv({ ...base, CPU_WORKERS: "0" })).toThrow(/CPU_WORKERS: CPU_WORKERS must be at least 1/);
    expect(() => readEnv({ ...base, SECURITY_LOG_RETENTION_DAYS: "365" })).toThrow(
      /SECURITY_LOG_RETENTION_DAYS: .*at least 366, so a whole year stays visible/,
    );
    expect(() => readEnv({ ...base, DECODE_CONCURRENCY: "0" })).toThrow(/DECODE_CONCURRENCY/);
    expect(() => readEnv({ ...base, CPU_WORKER_NICE: "20" })).toThrow(/CPU_WORKER_NICE/);
    expect(readEnv({ ...base, CPU_WORKERS: "1", MAIL_SENT_RETENTION_DAYS: "30" })).toMatchObject({
      CPU_WORKERS: 1,
      MAIL_SENT_RETENTION_DAYS: 30,
    });
  });
});
