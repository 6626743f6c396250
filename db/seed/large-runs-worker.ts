// A worker thread of the large seed: simulates and analyses one oven's runs at a time, so both
// cores work while the main thread writes to the database.
import { parentPort } from "node:worker_threads";
import { largeOven } from "./large-plant";
import { largeOvenRunStatements, type LargeRunContext } from "./large-runs";

parentPort!.on("message", ({ index, ctx }: { index: number; ctx: LargeRunContext }) => {
  try {
    parentPort!.postMessage({ index, batch: largeOvenRunStatements(largeOven(index), ctx) });
  } catch (err) {
    parentPort!.postMessage({ index, error: (err as Error).stack ?? String(err) });
  }
});
