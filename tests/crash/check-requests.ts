import type { Client } from "@libsql/client";
import type { Outcome } from "./burst";

// After a restart: every request answered 2xx is there with what its answer said; every request
// answered with an error left nothing; a request in flight at the kill is either wholly there
// or wholly absent (the whole-or-nothing part is checked by check-invariants.ts).

export type RequestCheck = { failures: string[]; answered2xx: number; answeredOther: number; inFlight: number; inFlightFound: number; found: number };

const ok = (s: number | null) => s !== null && s >= 200 && s < 300;

async function rows(client: Client, sql: string, args: (string | number)[]) {
  return (await client.execute({ sql, args })).rows;
}

async function audited(client: Client, o: Outcome) {
  if (o.kind === "upload") {
    const sql = "select 1 from audit_log a join run r on a.entity_id = cast(r.id as text) where a.action = 'run.create' and r.file_sha256 = ?";
    return (await rows(client, sql, [o.key])).length === 1;
  }
  if (o.kind === "close") return (await rows(client, "select 1 from audit_log where action = 'workorder.close' and entity_id = ?", [String(o.order.id)])).length === 1;
  const sql = "select 1 from audit_log a join work_order_attachment w on json_extract(a.after, '$.id') = w.id where a.action = 'workorder.attach' and w.sha256 = ?";
  return (await rows(client, sql, [o.key])).length === 1;
}

export async function checkRequests(client: Client, baseUrl: string, token: string, outcomes: Outcome[]): Promise<RequestCheck> {
  const r: RequestCheck = { failures: [], answered2xx: 0, answeredOther: 0, inFlight: 0, inFlightFound: 0, found: 0 };
  const fail = (o: Outcome, what: string) => r.failures.push(`${o.kind} ${o.key.slice(0, 16)} (${o.status ?? "no answer"}): ${what}`);
  const get = (path: string) => fetch(`${baseUrl}${path}`, { headers: { authorization: `Bearer ${token}` } });

  for (const o of outcomes) {
    if (ok(o.status)) r.answered2xx++;
    else if (o.status === null) r.inFlight++;
    else r.answeredOther++;
    let present = false;

    if (o.kind === "upload") {
      const found = await rows(client, "select id, oven_id, verdict_status, deleted_at from run where file_sha256 = ?", [o.key]);
      if (found.length > 1) fail(o, `${found.length} runs for one upload`);
      present = found.length === 1;
      if (ok(o.status)) {
        const body = o.body as { id: number; ovenId: number; verdict: { status: string } };
        const run = found.find((x) => Number(x.id) === body.id);
        if (!run) {
          fail(o, `run ${body.id} was answered 201 but is missing`);
          continue;
        }
        if (Number(run.oven_id) !== body.ovenId || run.verdict_status !== body.verdict.status || run.deleted_at !== null) fail(o, `run ${body.id} differs from its answer`);
        const detail = await get(`/api/v1/runs/${body.id}`);
        const json = detail.ok ? ((await detail.json()) as { channels: unknown[]; verdict: { status: string } }) : null;
        if (!json || json.channels.length !== 8 || json.verdict.status !== body.verdict.status) fail(o, `GET /api/v1/runs/${body.id} answered ${detail.status} or lost channels`);
        const file = await get(`/api/v1/runs/${body.id}/file`);
        const bytes = file.ok ? Buffer.from(await file.arrayBuffer()) : null;
        if (!bytes?.equals(o.bytes)) fail(o, `GET /api/v1/runs/${body.id}/file answered ${file.status} or other bytes`);
      }
    } else if (o.kind === "close") {
      const [wo] = await rows(client, "select state, version, completed_at from work_order where id = ?", [o.order.id]);
      const done = wo?.state === "done";
      present = done && Number(wo.version) === o.order.version + 1;
      const untouched = !done && Number(wo?.version) === o.order.version;
      if (ok(o.status)) {
        const body = o.body as { version: number; completedAt: string };
        if (!done || Number(wo.version) !== body.version || Number(wo.completed_at) !== Date.parse(body.completedAt)) {
          fail(o, `work order ${o.order.id} answered done at version ${body.version} but is ${wo?.state} at ${wo?.version}`);
        }
      } else if (!present && !untouched) fail(o, `work order ${o.order.id} is ${wo?.state} at version ${wo?.version}, neither before nor after the close`);
    } else {
      const found = await rows(client, "select id from work_order_attachment where sha256 = ?", [o.key]);
      if (found.length > 1) fail(o, `${found.length} attachment rows for one upload`);
      present = found.length === 1;
      if (ok(o.status) && !found.some((x) => Number(x.id) === (o.body as { id: number }).id)) fail(o, "attachment answered 201 is missing");
    }

    // What was written carries its audit entry, written in the same transaction.
    if (present && !(await audited(client, o))) fail(o, "written without its audit entry");
    if (present) r.found++;
    if (o.status === null && present) r.inFlightFound++;
    // An error answer means nothing was written.
    if (!ok(o.status) && o.status !== null && present) fail(o, "answered with an error, yet written");
  }
  return r;
}
