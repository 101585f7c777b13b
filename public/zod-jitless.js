// Runs before the app's modules (a classic script in <head>): zod compiles parsers with `new Function`
// unless told not to, and under our Content-Security-Policy (no 'unsafe-eval') even its probe is a
// reported violation. zod reads this shared config object when it loads.
globalThis.__zod_globalConfig = Object.assign(globalThis.__zod_globalConfig || {}, { jitless: true });
