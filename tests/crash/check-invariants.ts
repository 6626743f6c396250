import crypto from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import { TransactionRollbackError, asc, eq } from "drizzle-orm";
import type { Client } from "@libsql/client";
import type { Db, Tx } from "../../db/client";
import { driftPoints, driftStates } from "../../db/schema/drift";
import { recomputeOven } from "../../db/queries/drift";
import { uploadReferences } from "../../db/ops/upload-references";

// Whole-database checks after a crash: the file is sound, and nothing is half-written — no run
// without its channels, samples or audit entry, no drift state that skipped a run, no closed
// order without its completion time, no row pointing at a missing or torn file.

export type InvariantCheck = { failures: string[]; halfWritten: number; filesChecked: number; tempFilesLeft: number };

async function col(client: Client, sql: string, args: (string | number)[] = []) {
  return (await client.execute({ sql, args })).rows;
}

const sha256 = (b: Uint8Array) => crypto.createHash("sha256").update(b).digest("hex");

export async function checkInvariants(client: Client, db: Db, uploadDir: string, ovenIds: number[], since: number): Promise<InvariantCheck> {
  const r: InvariantCheck = { failures: [], halfWritten: 0, filesChecked: 0, tempFilesLeft: 0 };
  const half = (what: string) => {
    r.halfWritten++;
    r.failures.push(`half-written: ${what}`);
  };

  const integrity = (await col(client, "PRAGMA integrity_check")).map((x) => String(x[0]));
  if (integrity.join() !== "ok") r.failures.push(`integrity_check: ${integrity.slice(0, 5).join("; ")}`);
  const fk = await col(client, "PRAGMA foreign_key_check");
  if (fk.length) r.failures.push(`foreign_key_check: ${fk.length} rows, e.g. ${JSON.stringify(fk[0])}`);

  // Runs: channels, samples (as many channels as the channel rows), a verdict, an audit entry.
  for (const x of await col(
    client,
    `select r.id, r.verdict_status, s.channels as sample_channels, (select count(*) from run_channel c where c.run_id = r.id) as channel_rows
       from run r left join run_sample s on s.run_id = r.id
      where r.deleted_at is null
        and (s.run_id is null or r.verdict_status is null or channel_rows = 0 or channel_rows <> s.channels)`,
  )) {
    half(`run ${x.id}: ${x.channel_rows} channel rows, samples for ${x.sample_channels ?? "none"}, verdict ${x.verdict_status}`);
  }
  for (const x of await col(
    client,
    `select r.id from run r where r.created_at >= ? and not exists
       (select 1 from audit_log a where a.action = 'run.create' and a.entity = 'run' and a.entity_id = cast(r.id as text))`,
    [since],
  )) {
    half(`run ${x.id} has no run.create audit entry`);
  }

  // Work orders: done means completed (each close's audit entry is checked with its request).
  for (const x of await col(client, "select id from work_order where state = 'done' and completed_at is null")) half(`work order ${x.id} is done without completedAt`);
  // Files: every row's bytes are there and hash to the row's name.
  const root = path.resolve(uploadDir);
  const expectFile = (rel: string, sha: string, owner: string) => {
    r.filesChecked++;
    let bytes: Buffer;
    try {
      bytes = fs.readFileSync(path.join(root, rel));
    } catch {
      return half(`${owner} points at missing file ${rel}`);
    }
    if (sha256(bytes) !== sha) half(`${owner}: file ${rel} does not hash to ${sha.slice(0, 12)}… (torn write)`);
  };
  for (const ref of await uploadReferences(client)) expectFile(ref.path, ref.sha256, ref.owner);
  // Any file named by a hash must hold exactly those bytes; temporary files are orphans of a kill.
  for (const rel of fs.existsSync(root) ? fs.readdirSync(root, { recursive: true }).map(String) : []) {
    const base = path.basename(rel);
    if (base.endsWith(".tmp")) r.tempFilesLeft++;
    else if (/^[0-9a-f]{64}$/.test(base) && sha256(fs.readFileSync(path.join(root, rel))) !== base) half(`upload ${rel} is torn`);
  }

  // Drift: the stored state, stepped once per run, must equal a rebuild from the whole history.
  for (const ovenId of ovenIds) {
    const diff = await driftDifference(db, ovenId);
    if (diff) half(`oven ${ovenId} drift: ${diff}`);
  }
  return r;
}

async function driftSnapshot(tx: Tx, ovenId: number) {
  const points = await tx.select().from(driftPoints).where(eq(driftPoints.ovenId, ovenId)).orderBy(asc(driftPoints.metric), asc(driftPoints.runId));
  const states = await tx.select().from(driftStates).where(eq(driftStates.ovenId, ovenId)).orderBy(asc(driftStates.metric));
  return {
    points: points.map((p) => [p.metric, p.runId, p.value, p.ewma, p.cusumHigh, p.cusumLow] as const),
    states: states.map((s) => `${s.metric}:${s.lastRunId}`),
  };
}

/** Rebuilds the oven's drift inside a transaction that is rolled back, and says how it differs. */
async function driftDifference(db: Db, ovenId: number): Promise<string | null> {
  let diff: string | null = null;
  try {
    await db.transaction(async (tx) => {
      const stored = await driftSnapshot(tx, ovenId);
      await recomputeOven(tx, ovenId);
      const rebuilt = await driftSnapshot(tx, ovenId);
      if (stored.states.join() !== rebuilt.states.join()) diff = `last runs ${stored.states.join(" ")} ≠ rebuilt ${rebuilt.states.join(" ")}`;
      else if (stored.points.length !== rebuilt.points.length) diff = `${stored.points.length} drift points ≠ ${rebuilt.points.length} rebuilt`;
      else {
        const at = stored.points.findIndex((p, i) => p.some((v, j) => (typeof v === "number" ? Math.abs(v - (rebuilt.points[i][j] as number)) > 1e-6 * Math.max(1, Math.abs(v)) : v !== rebuilt.points[i][j])));
        if (at >= 0) diff = `point ${JSON.stringify(stored.points[at])} ≠ rebuilt ${JSON.stringify(rebuilt.points[at])}`;
      }
      tx.rollback();
    });
  } catch (err) {
    if (!(err instanceof TransactionRollbackError)) throw err;
  }
  return diff;
}
