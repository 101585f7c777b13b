/** Whether the process is shutting down: /readyz reports not-ready and connections are not kept alive. */
export interface Lifecycle {
  draining: boolean;
}

export function createLifecycle(): Lifecycle {
  return { draining: false };
}

/** Resolves once `done()` is true or the deadline passes; says which. */
export async function waitUntil(done: () => boolean, deadline: number, stepMs = 50): Promise<boolean> {
  while (!done()) {
    if (Date.now() >= deadline) return false;
    await new Promise((r) => setTimeout(r, stepMs));
  }
  return true;
}
