// Broodcast: loaded by index.html before the app's modules (docs/security.md). Zod decides when each
// schema is built whether to compile fast parsers with `new Function`; the Content-Security-Policy
// forbids eval, and the browser reports even zod's caught probe as a policy violation. Zod reads this
// global configuration when it loads; jitless parsing is the same parsing without the probe.
globalThis.__zod_globalConfig = Object.assign(globalThis.__zod_globalConfig || {}, { jitless: true });
