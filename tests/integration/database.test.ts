import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { sql } from "drizzle-orm";
import { createTestDb } from "./test-db";
import { seedDemo } from "@/db/seed/seed-demo";
import { ovens, lines, sites } from "@/db/schema/fleet";
import { users } from "@/db/schema/users";

let t: Awaited<ReturnType<typeof createTestDb>>;
beforeAll(async () => {
  t = await createTestDb();
});
afterAll(() => t.close());

describe("the embedded database", () => {
  it("runs with WAL, a busy timeout and foreign keys on", async () => {
    const mode = await t.db.get<{ journal_mode: string }>(sql`PRAGMA journal_mode`);
    expect(mode.journal_mode).toBe("wal");
    const fk = await t.db.get<{ foreign_keys: number }>(sql`PRAGMA foreign_keys`);
    expect(fk.foreign_keys).toBe(1);
    const busy = await t.db.get<{ timeout: number }>(sql`PRAGMA busy_timeout`);
    expect(busy.timeout).toBeGreaterThanOrEqual(5000);
  });

  it("refuses an oven on a line that does not exist (foreign key)", async () => {
    await expect(t.db.insert(ovens).values({ tag: "FK-1", name: "x", lineId: 424242, kind: "other" })).rejects.toThrow();
  });

  it("keeps the pragmas after a transaction hands its connection back", async () => {
    await t.db.transaction(async (tx) => {
      await tx.select().from(sites);
    });
    const fk = await t.db.get<{ foreign_keys: number }>(sql`PRAGMA foreign_keys`);
    expect(fk.foreign_keys).toBe(1);
  });
});

describe("the demo seed", () => {
  it("creates the Brightwater plant: one site, three lines, six ovens, one user per role", async () => {
    expect(await t.db.$count(sites)).toBe(1);
    expect(await t.db.$count(lines)).toBe(3);
    const tags = (await t.db.select({ tag: ovens.tag }).from(ovens)).map((r) => r.tag).sort();
    expect(tags).toEqual(["L1-RF1", "L1-RF2", "L2-RF1", "L2-RF2", "LAB-B1", "LAB-B2"]);
    const roles = (await t.db.select({ role: users.role }).from(users)).map((r) => r.role).sort();
    expect(roles).toEqual(["admin", "engineer", "manager", "technician", "viewer"]);
    const [site] = await t.db.select().from(sites);
    expect(site.timeZone).toBe("Europe/Dublin");
  });

  it("is idempotent: a second run adds nothing and changes nothing", async () => {
    const before = await t.db.select().from(ovens);
    const counts = await seedDemo(t.db, { password: "ovenward-demo" });
    expect(counts).toEqual({ users: 0, sites: 0, lines: 0, ovens: 0, subscriptions: 0, runs: 0, changes: 0 });
    expect(await t.db.select().from(ovens)).toEqual(before);
  });
});
