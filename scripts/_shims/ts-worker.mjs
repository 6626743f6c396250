// Worker threads do not inherit tsx's loader from `tsx --import …`: this entry registers it (and
// the server-only shim) in the worker, then loads the TypeScript module named in workerData.entry.
import { workerData } from "node:worker_threads";
import { register } from "tsx/esm/api";

register();
await import("./server-only.mjs");
await import(workerData.entry);
