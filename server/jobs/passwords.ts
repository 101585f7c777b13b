/**
 * Password hashing and checking off the event loop, on the process's CPU pool: twenty people
 * signing in at once must not stall every other request (`npm run bench:sign-in`).
 */
import { cpuPool } from "./cpu-pool";
import type { PasswordTask } from "./password.worker";

// A compare or hash never legitimately takes this long (cost 15 is about 3 s of CPU).
const PASSWORD_TASK_TIMEOUT_MS = 30_000;

export function bcryptHash(password: string, cost: number): Promise<string> {
  return cpuPool().run<PasswordTask, string>(
    "password",
    { op: "hash", password, cost },
    { timeoutMs: PASSWORD_TASK_TIMEOUT_MS },
  );
}

export function bcryptCompare(password: string, hash: string): Promise<boolean> {
  return cpuPool().run<PasswordTask, boolean>(
    "password",
    { op: "compare", password, hash },
    { timeoutMs: PASSWORD_TASK_TIMEOUT_MS },
  );
}
