import fs from "node:fs";
import path from "node:path";

/** Imports every lib/actions/*.ts so each defineAction registers itself in ACTION_REGISTRY. */
export async function loadAllActionDefinitions(): Promise<string[]> {
  const dir = path.resolve(__dirname, "../../lib/actions");
  const files = fs.readdirSync(dir).filter((f) => /\.ts$/.test(f)).sort();
  for (const f of files) await import(path.join(dir, f));
  return files;
}
