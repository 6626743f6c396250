import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { mailHarness, subscribe, at } from "./mail-harness";

/*
 * A digest due "Mondays at 07:30" on a Dublin clock goes out once, at the right UTC instant.
 * Expected instants: Ireland keeps GMT (UTC+0) in winter and IST (UTC+1) in summer, switching on
 * the last Sundays of March and October at 01:00 UTC (EU Directive 2000/84/EC). Cross-checked with
 * Python's zoneinfo (IANA tzdata), an implementation independent of ours:
 *   datetime(2027,1,4,7,30,tzinfo=ZoneInfo("Europe/Dublin")).astimezone(utc) → 2027-01-04 07:30Z (Monday)
 *   datetime(2027,6,7,7,30,tzinfo=ZoneInfo("Europe/Dublin")).astimezone(utc) → 2027-06-07 06:30Z (Monday)
 *   datetime(2027,3,29,7,30,…) → 06:30Z, the first Monday after the March change (28 March 2027).
 */
let h: Awaited<ReturnType<typeof mailHarness>>;
beforeAll(async () => {
  h = await mailHarness(2751);
});
afterAll(() => h.close());

const WEEKLY_MONDAY = { schedule: "FREQ=WEEKLY;BYDAY=MO", sendAt: "07:30" };

describe("weekly digest, Mondays 07:30 Europe/Dublin", () => {
  it("winter: nothing at 07:29Z, one message at 07:30Z, nothing more after", async () => {
    await subscribe(h.db, "manager@brightwater.example", "fleet_digest", { ...WEEKLY_MONDAY, createdAt: at("2027-01-01T12:00:00Z") });
    expect(await h.tick(at("2027-01-04T07:29:00Z"))).toMatchObject({ enqueued: 0, sent: 0 });
    expect(await h.tick(at("2027-01-04T07:29:59.999Z"))).toMatchObject({ enqueued: 0, sent: 0 });
    expect(await h.received()).toHaveLength(0);

    expect(await h.tick(at("2027-01-04T07:30:00Z"))).toEqual({ enqueued: 1, sent: 1, failed: 0, generated: 0, startedAt: expect.any(Date), finishedAt: expect.any(Date) });
    expect(await h.tick(at("2027-01-04T07:31:00Z"))).toEqual({ enqueued: 0, sent: 0, failed: 0, generated: 0, startedAt: expect.any(Date), finishedAt: expect.any(Date) });
    expect(await h.tick(at("2027-01-10T23:00:00Z"))).toMatchObject({ enqueued: 0, sent: 0 });
    const got = await h.received();
    expect(got).toHaveLength(1);
    expect(got[0].envelopeTo).toBe("manager@brightwater.example");
    expect(got[0].subject).toMatch(/^Fleet digest, week of 4 January 2027: 6 of 6 ovens in service$/);
    const [row] = await h.outboxRows();
    expect(row).toMatchObject({ state: "sent", attempts: 1, sentAt: at("2027-01-04T07:30:00Z") });
    expect(row.smtpResponse).toMatch(/^250 /);
    expect(row.idempotencyKey).toMatch(/^fleet_digest:[0-9a-f-]{36}:2027-01-04T07:30:00.000Z$/);
  });

  it("the next Monday's digest follows a week later, once", async () => {
    expect(await h.tick(at("2027-01-11T07:30:00Z"))).toMatchObject({ enqueued: 1, sent: 1 });
    expect(await h.tick(at("2027-01-11T07:30:00Z"))).toMatchObject({ enqueued: 0, sent: 0 });
    expect(await h.received()).toHaveLength(2);
  });

  it("after downtime only the latest missed occurrence is sent", async () => {
    // No tick ran between 11 January and 7 June 06:00Z (the server was "down"). Of the 20
    // Mondays missed, only the latest — 31 May 2027 07:30 IST = 06:30Z — goes out.
    expect(await h.tick(at("2027-06-07T06:00:00Z"))).toMatchObject({ enqueued: 1, sent: 1 });
    const manager = (await h.received()).filter((m) => m.envelopeTo === "manager@brightwater.example");
    expect(manager.map((m) => /week of ([\w ]+2027)/.exec(m.subject!)![1])).toEqual(["4 January 2027", "11 January 2027", "31 May 2027"]);
    const rows = await h.outboxRows();
    expect(rows[rows.length - 1].idempotencyKey).toMatch(/:2027-05-31T06:30:00.000Z$/);
  });

  it("summer: the same 07:30 on the Dublin clock is 06:30Z", async () => {
    await subscribe(h.db, "engineer@brightwater.example", "fleet_digest", { ...WEEKLY_MONDAY, createdAt: at("2027-06-01T12:00:00Z") });
    const toEngineer = async () => (await h.received()).filter((m) => m.envelopeTo === "engineer@brightwater.example");
    expect(await h.tick(at("2027-06-07T06:29:00Z"))).toMatchObject({ enqueued: 0, sent: 0 });
    expect(await toEngineer()).toHaveLength(0);
    // Manager and engineer both have 7 June 07:30 IST due now.
    expect(await h.tick(at("2027-06-07T06:30:00Z"))).toMatchObject({ enqueued: 2, sent: 2 });
    const engineer = await toEngineer();
    expect(engineer).toHaveLength(1);
    expect(engineer[0].subject).toContain("week of 7 June 2027");
    expect(await h.tick(at("2027-06-07T07:30:00Z"))).toMatchObject({ enqueued: 0, sent: 0 });
  });

  it("across the March change: 22 March at 07:30Z, 29 March at 06:30Z", async () => {
    await subscribe(h.db, "viewer@brightwater.example", "fleet_digest", { ...WEEKLY_MONDAY, createdAt: at("2027-03-20T00:00:00Z") });
    const viewer = async () => (await h.received()).filter((m) => m.envelopeTo === "viewer@brightwater.example").length;
    // Ticks run in time order; other subscribers' catch-up does not matter here.
    await h.tick(at("2027-03-22T07:29:00Z"));
    expect(await viewer()).toBe(0);
    await h.tick(at("2027-03-22T07:30:00Z"));
    expect(await viewer()).toBe(1);
    await h.tick(at("2027-03-29T06:29:00Z"));
    expect(await viewer()).toBe(1);
    await h.tick(at("2027-03-29T06:30:00Z"));
    expect(await viewer()).toBe(2);
  });
});
