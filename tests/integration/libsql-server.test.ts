import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq, sql } from "drizzle-orm";
import { openDatabase, type Db } from "@/db/client";
import { migrateDatabase } from "@/db/migrate";
import { lines, ovens, sites } from "@/db/schema/fleet";
import { findSqld, portFrom, startSqld } from "@/scripts/support/deploy-stack";

// The same code against a libSQL server (sqld) over HTTP, as DATABASE_URL=http://… deploys it:
// migrations, foreign keys, transactions that commit or roll back whole, and many at once.
const hasSqld = findSqld() !== null;

let dir: string;
let server: Awaited<ReturnType<typeof startSqld>>;
let db: Db;
let close: () => void;

beforeAll(async () => {
  if (!hasSqld) return;
  dir = fs.mkdtempSync(path.join(os.tmpdir(), "ovenward-sqld-"));
  server = await startSqld({ dir, port: await portFrom("VITEST_SQLD_PORT") });
  const opened = await openDatabase(server.url);
  db = opened.db;
  close = () => opened.client.close();
  await migrateDatabase(db);
});
afterAll(async () => {
  close?.();
  await server?.stop();
  if (dir) fs.rmSync(dir, { recursive: true, force: true });
});

describe.skipIf(!hasSqld)("a libSQL server (sqld) over HTTP", () => {
  it("takes the migrations, and again without change", async () => {
    const tables = await db.all<{ name: string }>(sql`SELECT name FROM sqlite_master WHERE type = 'table' AND name IN ('oven', 'run', 'outbox', 'scheduler_lease')`);
    expect(tables.map((t) => t.name).sort()).toEqual(["outbox", "oven", "run", "scheduler_lease"]);
    await expect(migrateDatabase(db)).resolves.toBeUndefined();
  });

  it("enforces foreign keys on every request (there is no connection to set a pragma on)", async () => {
    await expect(db.insert(ovens).values({ tag: "FK-SQLD", name: "x", lineId: 424242, kind: "other" })).rejects.toMatchObject({ cause: { message: expect.stringMatching(/FOREIGN KEY constraint failed/i) } });
  });

  it("rolls a failed transaction back whole", async () => {
    await expect(
      db.transaction(async (tx) => {
        await tx.insert(sites).values({ name: "Half-written site", timeZone: "Europe/Dublin" });
        throw new Error("stop here");
      }),
    ).rejects.toThrow("stop here");
    expect(await db.select().from(sites).where(eq(sites.name, "Half-written site"))).toEqual([]);
  });

  it("runs twenty write transactions at once, each reading its own writes, none lost", async () => {
    const [site] = await db.insert(sites).values({ name: "Concurrency site", timeZone: "Europe/Dublin" }).returning();
    const results = await Promise.all(
      Array.from({ length: 20 }, (_, i) =>
        db.transaction(async (tx) => {
          const [line] = await tx.insert(lines).values({ siteId: site.id, name: `Line ${i}` }).returning();
          const [seen] = await tx.select().from(lines).where(eq(lines.id, line.id));
          return seen.name;
        }),
      ),
    );
    expect(results.sort()).toEqual(Array.from({ length: 20 }, (_, i) => `Line ${i}`).sort());
    expect(await db.$count(lines, eq(lines.siteId, site.id))).toBe(20);
  });
});
