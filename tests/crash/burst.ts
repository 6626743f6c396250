import crypto from "node:crypto";
import fs from "node:fs";

// One burst of concurrent writes against the running app: logger-file uploads (each file
// different, so each run is found again by its file's hash), work-order closes (each order
// different, with every mandatory checklist item answered) and photo attachments.

export type OpenOrder = { id: number; version: number; checklist: { id: string; mandatory: boolean }[] };

export type Planned =
  | { kind: "upload"; key: string; ovenId: number; bytes: Buffer; name: string }
  | { kind: "close"; key: string; order: OpenOrder }
  | { kind: "attach"; key: string; workOrderId: number; bytes: Buffer };

export type Outcome = Planned & {
  /** null when no complete answer came back (in flight when the app was killed). */
  status: number | null;
  body: unknown;
  error?: string;
  answeredAfterKill: boolean;
};

const base = fs.readFileSync("tests/fixtures/logger-files/generic-8ch.csv", "utf8");

/** The fixture with the first probe's reading at t = 0 nudged by n × 0.001 °C: same curve, its own hash. */
export function loggerFile(n: number): Buffer {
  const lines = base.split("\n");
  const cells = lines[1].split(",");
  cells[1] = (Number(cells[1]) + n * 0.001).toFixed(3);
  lines[1] = cells.join(",");
  return Buffer.from(lines.join("\n"));
}

const sha = (b: Buffer) => crypto.createHash("sha256").update(b).digest("hex");

export function planBurst(round: number, ovenIds: number[], orders: OpenOrder[], counts: { uploads: number; attachments: number }): Planned[] {
  const planned: Planned[] = [];
  for (let i = 0; i < counts.uploads; i++) {
    const bytes = loggerFile(round * 1000 + i + 1);
    planned.push({ kind: "upload", key: sha(bytes), ovenId: ovenIds[i % ovenIds.length], bytes, name: `crash-r${round}-${i}.csv` });
  }
  for (const order of orders) planned.push({ kind: "close", key: `wo-${order.id}`, order });
  for (let i = 0; i < counts.attachments; i++) {
    // PNG signature, then bytes of its own: the app checks the signature, and the hash is unique.
    const bytes = Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), crypto.randomBytes(48 * 1024)]);
    planned.push({ kind: "attach", key: sha(bytes), workOrderId: orders[i % orders.length].id, bytes });
  }
  // Interleave the kinds so uploads, closes and attachments are in flight together.
  return planned.map((p, i) => ({ p, k: (i * 7919) % planned.length })).sort((a, b) => a.k - b.k).map((x) => x.p);
}

function request(baseUrl: string, token: string, p: Planned): Promise<Response> {
  const headers = { authorization: `Bearer ${token}` };
  if (p.kind === "upload") {
    const form = new FormData();
    form.set("file", new Blob([new Uint8Array(p.bytes)], { type: "text/csv" }), p.name);
    return fetch(`${baseUrl}/api/v1/ovens/${p.ovenId}/runs`, { method: "POST", headers, body: form });
  }
  if (p.kind === "attach") {
    const form = new FormData();
    form.set("file", new Blob([new Uint8Array(p.bytes)], { type: "image/png" }), "photo.png");
    return fetch(`${baseUrl}/api/v1/work-orders/${p.workOrderId}/attachments`, { method: "POST", headers, body: form });
  }
  const checklistResults = Object.fromEntries(p.order.checklist.map((c) => [c.id, { ok: true, note: "crash test" }]));
  return fetch(`${baseUrl}/api/v1/work-orders/${p.order.id}`, {
    method: "PATCH",
    headers: { ...headers, "content-type": "application/json" },
    body: JSON.stringify({ version: p.order.version, state: "done", checklistResults }),
  });
}

/**
 * Loads the three routes with requests they refuse (400, nothing written), so the burst does not
 * wait on a cold server and then come back all at once, before the kill could land among it.
 */
export async function warmUp(baseUrl: string, token: string, ovenId: number, workOrderId: number) {
  const headers = { authorization: `Bearer ${token}` };
  const empty = () => {
    const f = new FormData();
    f.set("note", "no file");
    return f;
  };
  const answers = await Promise.all([
    fetch(`${baseUrl}/api/v1/ovens/${ovenId}/runs`, { method: "POST", headers, body: empty() }),
    fetch(`${baseUrl}/api/v1/work-orders/${workOrderId}/attachments`, { method: "POST", headers, body: empty() }),
    fetch(`${baseUrl}/api/v1/work-orders/${workOrderId}`, { method: "PATCH", headers: { ...headers, "content-type": "application/json" }, body: "{}" }),
  ]);
  const statuses = answers.map((a) => a.status);
  if (statuses.some((s) => s !== 400)) throw new Error(`warm-up requests answered ${statuses.join(", ")}, expected 400 each`);
}

/**
 * Sends every planned request at once and calls `kill` as soon as `killAfter` answers have come
 * back (whatever their status), so some requests are answered and the rest are in flight.
 */
export async function fireBurst(baseUrl: string, token: string, planned: Planned[], killAfter: number, kill: () => Promise<void>): Promise<{ outcomes: Outcome[] }> {
  let answered = 0;
  let killed = false;
  let killing: Promise<void> | null = null;
  const triggerKill = () => {
    if (killing) return;
    killed = true;
    killing = kill();
  };
  const outcomes = await Promise.all(
    planned.map(async (p): Promise<Outcome> => {
      try {
        const res = await request(baseUrl, token, p);
        const body = await res.json().catch(() => undefined);
        const afterKill = killed;
        // A status line whose body was cut off by the kill is no answer: the caller never learnt the outcome.
        if (body === undefined) return { ...p, status: null, body: null, error: `status ${res.status}, body cut off`, answeredAfterKill: false };
        answered++;
        if (answered >= killAfter) triggerKill();
        return { ...p, status: res.status, body, answeredAfterKill: afterKill };
      } catch (err) {
        return { ...p, status: null, body: null, error: (err as Error).cause ? String((err as Error).cause) : (err as Error).message, answeredAfterKill: false };
      }
    }),
  );
  // Everything was answered before the threshold (a quick machine): the kill still happens, with nothing in flight.
  triggerKill();
  await killing;
  return { outcomes };
}
