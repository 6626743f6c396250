// The checks of `npm run test:deploy`, against two running instances sharing one database and bucket.
import crypto from "node:crypto";
import fs from "node:fs";
import { eq, isNotNull, sql } from "drizzle-orm";
import type { Db } from "../../db/client";
import { createApiToken } from "../../db/queries/api-tokens";
import { getUserByEmail } from "../../db/queries/users";
import { ovens } from "../../db/schema/fleet";
import { workOrders } from "../../db/schema/maintenance";
import { outbox, sinkMessages } from "../../db/schema/mail";
import { runs } from "../../db/schema/runs";

export type Check = (name: string, ok: boolean, detail?: string) => void;
type Instance = { name: string; url: string };
type Ctx = { db: Db; a: Instance; b: Instance; check: Check };

const sha256 = (b: Uint8Array) => crypto.createHash("sha256").update(b).digest("hex");
let bearer = "";

/** Bearer tokens and a session cookie issued by A are honoured by B: nothing of a session lives in an instance. */
export async function checkSignedIn({ db, a, b, check }: Ctx) {
  const tech = await getUserByEmail(db, "tech@brightwater.example");
  bearer = (await createApiToken(db, { userId: tech!.id, name: "deploy-test" }, null)).secret;
  for (const inst of [a, b]) {
    const res = await fetch(`${inst.url}/api/v1/me`, { headers: { authorization: `Bearer ${bearer}` } });
    const me = res.ok ? await res.json() : null;
    check(`${inst.name} GET /api/v1/me with an API token`, res.status === 200 && JSON.stringify(me).includes("tech@brightwater.example"), `HTTP ${res.status}`);
  }
  // Sign in with e-mail and password on A (Auth.js: CSRF token, then the credentials callback).
  const csrfRes = await fetch(`${a.url}/api/auth/csrf`);
  const { csrfToken } = (await csrfRes.json()) as { csrfToken: string };
  const jar = csrfRes.headers.getSetCookie().map((c) => c.split(";")[0]);
  const form = new URLSearchParams({ email: "engineer@brightwater.example", password: "ovenward-demo", csrfToken, callbackUrl: `${a.url}/fleet` });
  const signIn = await fetch(`${a.url}/api/auth/callback/credentials`, { method: "POST", body: form, redirect: "manual", headers: { cookie: jar.join("; "), "content-type": "application/x-www-form-urlencoded" } });
  const session = signIn.headers.getSetCookie().map((c) => c.split(";")[0]).find((c) => c.startsWith("authjs.session-token="));
  check("signing in on instance A sets a session cookie", !!session, `HTTP ${signIn.status}`);
  if (!session) return;
  const onB = await fetch(`${b.url}/api/v1/me`, { headers: { cookie: session } });
  const me = onB.ok ? await onB.json() : null;
  check("instance B accepts A's session cookie (GET /api/v1/me)", onB.status === 200 && JSON.stringify(me).includes("engineer@brightwater.example"), `HTTP ${onB.status}`);
}

export async function checkSharedRun({ db, a, b, check, inBucket }: Ctx & { inBucket: (sha: string) => Promise<boolean> }) {
  const auth = { authorization: `Bearer ${bearer}` };
  const [oven] = await db.select({ id: ovens.id }).from(ovens).where(eq(ovens.tag, "L1-RF1"));
  const csv = fs.readFileSync("tests/fixtures/logger-files/generic-8ch.csv");
  const form = new FormData();
  form.set("file", new Blob([csv], { type: "text/csv" }), "deploy-check.csv");
  const up = await fetch(`${a.url}/api/v1/ovens/${oven.id}/runs`, { method: "POST", headers: auth, body: form });
  const created = up.ok ? ((await up.json()) as { id: number }) : null;
  check("instance A records a run (POST /api/v1/ovens/{id}/runs)", up.status === 201 && !!created, `HTTP ${up.status}`);
  if (!created) return;
  const json = await fetch(`${b.url}/api/v1/runs/${created.id}`, { headers: auth });
  const run = json.ok ? await json.json() : null;
  check(`instance B reads run ${created.id} (GET /api/v1/runs/{id})`, json.status === 200 && JSON.stringify(run).includes(`"id":${created.id}`), `HTTP ${json.status}`);
  const file = await fetch(`${b.url}/api/v1/runs/${created.id}/file`, { headers: auth });
  const bytes = new Uint8Array(await file.arrayBuffer());
  check("instance B serves the original file byte for byte", file.status === 200 && sha256(bytes) === sha256(csv), `HTTP ${file.status}, ${bytes.length} of ${csv.length} bytes`);
  check("the file is in the bucket under files/<2 hex>/<sha256>", await inBucket(sha256(csv)));
  // A logger file the seed stored (through the same store, before the instances started).
  const [seeded] = await db.select({ id: runs.id, sha: runs.fileSha256 }).from(runs).where(isNotNull(runs.fileSha256)).limit(1);
  const old = await fetch(`${a.url}/api/v1/runs/${seeded.id}/file`, { headers: auth });
  check(`instance A serves seeded run ${seeded.id}'s file from the bucket`, old.status === 200 && sha256(new Uint8Array(await old.arrayBuffer())) === seeded.sha && (await inBucket(seeded.sha!)), `HTTP ${old.status}`);
}

type TickAnswer = { status: number; from: string; body: { enqueued?: number; sent?: number; generated?: number; skipped?: string; startedAt?: string; finishedAt?: string } };

/** Rounds of simultaneous ticks on both instances: the lease lets one run at a time, nothing is done twice. */
export async function checkCron({ db, a, b, check, secret }: Ctx & { secret: string }) {
  const count = async (q: Promise<{ n: number }[]>) => Number((await q)[0].n);
  // A weekly plan started three weeks ago, made through A, gives the ticks work orders to generate.
  const manager = await getUserByEmail(db, "manager@brightwater.example");
  const managerToken = (await createApiToken(db, { userId: manager!.id, name: "deploy-test-plans" }, null)).secret;
  const ovenIds = (await db.select({ id: ovens.id }).from(ovens).limit(2)).map((o) => o.id);
  const dtstart = new Date(Date.now() - 21 * 86_400_000).toISOString().slice(0, 16);
  const plan = await fetch(`${a.url}/api/v1/plans`, {
    method: "POST",
    headers: { authorization: `Bearer ${managerToken}`, "content-type": "application/json" },
    body: JSON.stringify({ ovenIds, title: "Deployment check: weekly belt inspection", rrule: "FREQ=WEEKLY", dtstart, lookAheadDays: 14 }),
  });
  check("a manager creates a weekly plan on two ovens through A (POST /api/v1/plans)", plan.status === 201, `HTTP ${plan.status}`);
  const ordersBefore = await count(db.select({ n: sql<number>`count(*)` }).from(workOrders));
  const sentBefore = await count(db.select({ n: sql<number>`count(*)` }).from(outbox).where(eq(outbox.state, "sent")));
  const sinkBefore = await count(db.select({ n: sql<number>`count(*)` }).from(sinkMessages));
  const tick = async (inst: Instance): Promise<TickAnswer> => {
    const res = await fetch(`${inst.url}/api/cron/tick`, { method: "POST", headers: { authorization: `Bearer ${secret}` } });
    return { status: res.status, from: inst.name, body: await res.json() };
  };
  const answers: TickAnswer[] = [];
  const ROUNDS = 4;
  for (let round = 1; round <= ROUNDS; round++) {
    const got = await Promise.all([tick(a), tick(b), tick(a), tick(b)]);
    answers.push(...got);
    const ran = got.filter((g) => g.status === 200 && !g.body.skipped);
    console.log(`    round ${round}: ${got.map((g) => `${g.from.slice(-1).toUpperCase()} ${g.status === 200 ? (g.body.skipped ?? `ran (generated ${g.body.generated}, enqueued ${g.body.enqueued}, sent ${g.body.sent})`) : `HTTP ${g.status}`}`).join("; ")}`);
    check(`round ${round}: every call answered 200 and at least one tick ran`, got.every((g) => g.status === 200) && ran.length >= 1, `${ran.length} ran`);
  }
  const ran = answers.filter((x) => x.status === 200 && !x.body.skipped).map((x) => ({ from: Date.parse(x.body.startedAt!), to: Date.parse(x.body.finishedAt!) })).sort((p, q) => p.from - q.from);
  const overlaps = ran.filter((r, i) => i > 0 && r.from < ran[i - 1].to).length;
  check("no two ticks held the lease at the same time (their start–finish times do not overlap)", ran.length > 0 && ran.every((r) => r.from <= r.to) && overlaps === 0, `${ran.length} ran, ${overlaps} overlapping`);
  const skipped = answers.filter((x) => x.body.skipped === "lease_held").length;
  check("ticks sent while another held the lease were skipped (lease_held)", skipped >= 1, `${skipped} of ${answers.length} skipped`);
  const generated = answers.reduce((s, x) => s + (x.body.generated ?? 0), 0);
  const ordersAfter = await count(db.select({ n: sql<number>`count(*)` }).from(workOrders));
  check("the ticks generated the plan's orders, each once: orders created = the sum the ticks reported > 0", generated > 0 && ordersAfter - ordersBefore === generated, `${ordersAfter - ordersBefore} created, ${generated} reported`);
  const sent = answers.reduce((s, x) => s + (x.body.sent ?? 0), 0);
  const sentRows = (await count(db.select({ n: sql<number>`count(*)` }).from(outbox).where(eq(outbox.state, "sent")))) - sentBefore;
  const mail = (await db.select({ headers: sinkMessages.headers }).from(sinkMessages)).slice(sinkBefore);
  const ids = mail.map((m) => (m.headers as Record<string, string>)["message-id"]);
  check("each message reached the SMTP sink once (no Message-ID twice)", new Set(ids).size === ids.length, `${ids.length} received, ${new Set(ids).size} distinct`);
  check("messages received = outbox rows marked sent = sends the ticks reported", ids.length === sentRows && sentRows === sent, `${ids.length} / ${sentRows} / ${sent}`);
  const stuck = await count(db.select({ n: sql<number>`count(*)` }).from(outbox).where(eq(outbox.state, "sending")));
  check("no outbox row left claimed (state sending)", stuck === 0, `${stuck}`);
}
