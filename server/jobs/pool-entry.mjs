// The file every worker of the CPU pool runs (server/jobs/cpu-pool.ts). Plain JavaScript on purpose:
// a worker thread starts without the parent's TypeScript loader, so tsx is registered here, once,
// before the first TypeScript task module is imported. Compiled (.js) modules need no loader.
const loaded = new Map();
let tsxRegistered = false;

/** Runs one task: the default export of `module` called with `payload`. */
export default async function runTask({ module, payload }) {
  if (module.endsWith(".ts") && !tsxRegistered) {
    const { register } = await import("tsx/esm/api");
    register();
    tsxRegistered = true;
  }
  let mod = loaded.get(module);
  if (!mod) loaded.set(module, (mod = import(module)));
  return (await mod).default(payload);
}
