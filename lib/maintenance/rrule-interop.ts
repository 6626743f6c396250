import * as rruleModule from "rrule";

/*
 * rrule 2.8.1 ships an ES module build ("module" field) and a UMD build ("main"), but no
 * "exports" map. Bundlers (Next, Vite) pick the ES build and expose named exports; plain Node ESM
 * (tsx scripts such as the demo-data loader, vitest's externalised deps) loads the UMD build, whose named exports
 * Node cannot detect, so `import { RRule } from "rrule"` fails there. Reading the namespace
 * with a `default` fallback works under both loaders.
 */
type RRuleModule = typeof import("rrule");
const ns = rruleModule as unknown as RRuleModule & { default?: RRuleModule };

export const RRule: RRuleModule["RRule"] = ns.RRule ?? (ns.default as RRuleModule).RRule;
export type RRuleInstance = InstanceType<RRuleModule["RRule"]>;
export type RRuleOptions = import("rrule").Options;
