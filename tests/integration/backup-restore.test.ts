import { spawn } from "node:child_process";
import crypto from "node:crypto";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { createClient, type Client } from "@libsql/client";
import { eq, sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { workOrderAttachments, workOrderComments, workOrders } from "@/db/schema/maintenance";
import { recordAudit } from "@/db/queries/audit";
import { backupDatabase, databaseFile } from "@/db/ops/backup";
import { restoreDatabase } from "@/db/ops/restore";
import { tableDigests } from "@/db/ops/table-digest";
import { uploadReferences } from "@/db/ops/upload-references";
import { writeFileDurably } from "@/lib/storage/fsync";
import { contentKey } from "@/lib/storage/content-hash";
import { actorFor, createTestDb } from "./test-db";

// db:backup while a write transaction is open on the database, then db:restore into a new place:
// the restored database passes integrity_check and equals, table by table and row by row, the
// source as it was at one commit — before or after the concurrent write, never a mix.

let t: Awaited<ReturnType<typeof createTestDb>>;
let reader: Client;
let dir: string;
beforeAll(async () => {
  t = await createTestDb();
  // A second connection, as another process would have: it sees committed states only.
  reader = createClient({ url: t.url });
  dir = fs.mkdtempSync(path.join(os.tmpdir(), "ovenward-backup-"));
});
afterAll(() => {
  reader.close();
  t.close();
  fs.rmSync(dir, { recursive: true, force: true });
});

const sha256 = (b: Uint8Array) => crypto.createHash("sha256").update(b).digest("hex");
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** A separate process that opens the database and keeps it open until killed. */
async function holdOpen(file: string) {
  const code = `const { createClient } = require("@libsql/client"); const c = createClient({ url: ${JSON.stringify(`file:${file}`)} });
    c.execute("select count(*) from sqlite_master").then(() => { console.log("open"); setInterval(() => {}, 1000); });`;
  const child = spawn(process.execPath, ["-e", code], { stdio: ["ignore", "pipe", "inherit"] });
  await new Promise<void>((resolve, reject) => {
    child.stdout!.on("data", (d) => String(d).includes("open") && resolve());
    child.once("exit", (c) => reject(new Error(`the holder exited (${c})`)));
  });
  return child;
}

/** One write touching four tables in one transaction, its file written first as the app does. */
async function writeStep(uploadDir: string, step: number, midway?: () => Promise<void>) {
  const actor = await actorFor(t.db, "technician");
  const [order] = await t.db.select().from(workOrders).where(eq(workOrders.state, "open")).orderBy(workOrders.id).limit(1);
  const bytes = Buffer.from(`%PDF-1.7\nbackup test step ${step} ${crypto.randomUUID()}\n`);
  const sha = sha256(bytes);
  await writeFileDurably(path.join(uploadDir, contentKey(sha)), bytes);
  await t.db.transaction(async (tx) => {
    const [att] = await tx.insert(workOrderAttachments).values({ workOrderId: order.id, sha256: sha, fileName: `step-${step}.pdf`, contentType: "application/pdf", sizeBytes: bytes.length, uploadedById: actor.userId }).returning();
    if (midway) await midway();
    await tx.insert(workOrderComments).values({ workOrderId: order.id, authorId: actor.userId, body: `step ${step}`, mentions: [] });
    await tx.update(workOrders).set({ touched: true, version: sql`${workOrders.version} + 1` as unknown as number }).where(eq(workOrders.id, order.id));
    await recordAudit(tx, { actor, action: "workorder.attach", entity: "work_order", entityId: order.id, after: att });
  });
}

describe("db:backup and db:restore", () => {
  it("backs up during a write; the restore passes integrity_check and equals the source at one commit, table by table", { timeout: 180_000 }, async () => {
    const uploadDir = path.join(dir, "uploads");
    // The seeded rows' logger files live beside the shared template; stand-ins here give every
    // row its file, so the backup must report none missing.
    for (const ref of await uploadReferences(reader)) await writeFileDurably(path.join(uploadDir, ref.path), Buffer.from(`seeded ${ref.sha256}`));

    await writeStep(uploadDir, 1);
    const before = await tableDigests(reader);

    let releaseWriter!: () => void;
    const backupRunning = new Promise<void>((r) => (releaseWriter = r));
    let atMidway!: () => void;
    const midway = new Promise<void>((r) => (atMidway = r));
    // The writer holds its transaction open half-way until the backup has begun, then commits
    // while VACUUM INTO is still copying.
    const writing = writeStep(uploadDir, 2, async () => {
      atMidway();
      await backupRunning;
      await sleep(30);
    });
    await midway;
    const out = path.join(dir, "backups", "ovenward.db");
    const backupDone = backupDatabase({ url: t.url, out, uploadDir });
    releaseWriter();
    const backup = await backupDone;
    await writing;
    const after = await tableDigests(reader);
    expect(after).not.toEqual(before);
    expect(after.work_order_comment.rows).toBe(before.work_order_comment.rows + 1);

    expect(backup.database.integrity).toBe("ok");
    expect(backup.uploads.missing).toEqual([]);
    expect(backup.uploads.files).toBe(fs.readdirSync(uploadDir, { recursive: true }).filter((f) => fs.statSync(path.join(uploadDir, String(f))).isFile()).length);

    const restoredFile = path.join(dir, "restored", "ovenward.db");
    const restoredUploads = path.join(dir, "restored-uploads");
    const restored = await restoreDatabase({ url: `file:${restoredFile}`, from: out, uploadDir: restoredUploads });
    expect(restored.keptAside).toBeNull();
    expect(restored.uploads.missing).toEqual([]);
    const client = createClient({ url: `file:${restoredFile}` });
    try {
      expect((await client.execute("PRAGMA integrity_check")).rows.map((r) => String(r[0]))).toEqual(["ok"]);
      const digests = await tableDigests(client);
      // Exactly one of the two committed states, every table at once.
      const matches = [before, after].filter((s) => JSON.stringify(s) === JSON.stringify(digests));
      expect(matches).toHaveLength(1);
      expect(Object.fromEntries(Object.entries(digests).map(([k, v]) => [k, v.rows]))).toEqual(backup.database.tables);

      for (const ref of await uploadReferences(client)) {
        expect(fs.readFileSync(path.join(restoredUploads, ref.path)).equals(fs.readFileSync(path.join(uploadDir, ref.path)))).toBe(true);
      }
    } finally {
      client.close();
    }

    // While another process (standing in for the app) has the database open, restoring over it is refused.
    const holder = await holdOpen(restoredFile);
    try {
      await expect(restoreDatabase({ url: `file:${restoredFile}`, from: out, uploadDir: restoredUploads })).rejects.toThrow(`is open in process ${holder.pid}`);
    } finally {
      holder.kill();
      await new Promise((r) => holder.once("exit", r));
    }

    // Once closed, a second restore keeps the database it replaces aside.
    const again = await restoreDatabase({ url: `file:${restoredFile}`, from: out, uploadDir: restoredUploads, now: new Date("2030-01-01T00:00:00Z") });
    expect(again.keptAside).toBe(`${restoredFile}.before-restore-20300101-000000`);
    expect(fs.existsSync(again.keptAside!)).toBe(true);
  });

  it("refuses a backup that was changed or cut short, and leaves the database as it was", { timeout: 120_000 }, async () => {
    const out = path.join(dir, "backups", "second.db");
    await backupDatabase({ url: t.url, out, uploadDir: path.join(dir, "no-uploads") });
    const target = path.join(dir, "target", "ovenward.db");
    fs.mkdirSync(path.dirname(target), { recursive: true });
    fs.writeFileSync(target, "the current database");

    const changed = path.join(dir, "backups", "changed.db");
    fs.copyFileSync(out, changed);
    fs.copyFileSync(`${out}.json`, `${changed}.json`);
    const fd = fs.openSync(changed, "r+");
    fs.writeSync(fd, Buffer.from("x"), 0, 1, 100_000);
    fs.closeSync(fd);
    await expect(restoreDatabase({ url: `file:${target}`, from: changed, uploadDir: path.join(dir, "u2") })).rejects.toThrow("does not match the SHA-256");

    // Without a manifest, integrity_check on the staged copy catches a cut-off file.
    const cut = path.join(dir, "backups", "cut.db");
    fs.writeFileSync(cut, fs.readFileSync(out).subarray(0, Math.floor(fs.statSync(out).size / 2)));
    await expect(restoreDatabase({ url: `file:${target}`, from: cut, uploadDir: path.join(dir, "u2") })).rejects.toThrow(/integrity_check|cannot be read/);

    expect(fs.readFileSync(target, "utf8")).toBe("the current database");
    expect(fs.readdirSync(path.dirname(target))).toEqual(["ovenward.db"]);
  });

  it("leaves a libSQL server to its own backup tools", () => {
    expect(() => databaseFile("libsql://db.example.net")).toThrow(/libSQL server: back it up with that server's own/);
    expect(databaseFile("file:./data/x.db")).toBe(path.resolve("data/x.db"));
  });
});
