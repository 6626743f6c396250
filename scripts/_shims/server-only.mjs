// Scripts and tests run the same db/queries code as the app, outside React's server runtime.
// The "server-only" marker would throw there, so resolve it to an empty module, for both
// ESM imports (a resolve hook) and the CommonJS requires that tsx compiles TypeScript into.
import { register, createRequire } from "node:module";
register("./server-only-hooks.mjs", import.meta.url);
const require = createRequire(import.meta.url);
const Module = require("node:module");
const empty = require.resolve("./empty.cjs");
const original = Module._resolveFilename;
Module._resolveFilename = function (request, ...rest) {
  return request === "server-only" ? empty : original.call(this, request, ...rest);
};
