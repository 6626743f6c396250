import crypto from "node:crypto";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import fc from "fast-check";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { and, eq } from "drizzle-orm";
import { actorFor, createTestDb } from "./test-db";
import { runAction } from "@/lib/action";
import { createChangeDef } from "@/lib/actions/changes";
import { createCalibrationDef } from "@/lib/actions/measurement";
import { createApiToken } from "@/db/queries/api-tokens";
import { getUserByEmail } from "@/db/queries/users";
import { ovens } from "@/db/schema/fleet";
import { instruments } from "@/db/schema/instruments";
import { workOrders } from "@/db/schema/maintenance";
import { changes } from "@/db/schema/changes";
import type { Role } from "@/db/schema/users";
import { hostileFileName } from "./fuzz/arbitraries";

// Every upload path, through its route handler: what a file is comes from its bytes, never from
// its name or the type the client claims, and what is stored sits inside UPLOAD_DIR, named by
// the SHA-256 of its bytes, whatever name or id the client sends. (Storage internals are being
// reworked elsewhere; these checks hold for any layout under UPLOAD_DIR.)
vi.mock("@/lib/auth", () => ({ auth: async () => null }));

const FIX = path.resolve(__dirname, "../fixtures");
const PNG = new Uint8Array(fs.readFileSync(path.join(FIX, "checklist-photo.png")));
const CSV = new Uint8Array(fs.readFileSync(path.join(FIX, "logger-files/generic-8ch.csv")));
const PDF = new TextEncoder().encode("%PDF-1.7\n1 0 obj <<>> endobj\ntrailer <<>>\n%%EOF\n");
const HTML = new TextEncoder().encode("<!doctype html><script>alert(document.cookie)</script>");
const SVG = new TextEncoder().encode('<svg xmlns="http://www.w3.org/2000/svg" onload="alert(1)"/>');
const EXE = Uint8Array.from([0x4d, 0x5a, 0x90, 0, 3, 0, 0, 0, 4, 0]);

let t: Awaited<ReturnType<typeof createTestDb>>;
let sandbox: string; // sandbox/a/b/uploads: anything escaping UPLOAD_DIR would land in a, b or sandbox
let uploadDir: string;
const tokens = {} as Record<Role, string>;
let ids: { workOrderId: number; changeId: number; instrumentId: number; ovenId: number };

beforeAll(async () => {
  t = await createTestDb();
  sandbox = fs.mkdtempSync(path.join(os.tmpdir(), "ovenward-uploads-"));
  uploadDir = path.join(sandbox, "a", "b", "uploads");
  fs.mkdirSync(uploadDir, { recursive: true });
  Object.assign(process.env, { DATABASE_URL: t.url, UPLOAD_DIR: uploadDir, API_RATE_LIMIT_PER_MINUTE: "0" });
  for (const role of ["technician", "engineer", "viewer"] as Role[]) {
    const u = await getUserByEmail(t.db, role === "technician" ? "tech@brightwater.example" : `${role}@brightwater.example`);
    tokens[role] = (await createApiToken(t.db, { userId: u!.id, name: `uploads-${role}` }, null)).secret;
  }
  const [oven] = await t.db.select().from(ovens).where(eq(ovens.tag, "LAB-B2"));
  const [wo] = await t.db.select().from(workOrders).where(and(eq(workOrders.ovenId, oven.id), eq(workOrders.state, "open"))).limit(1);
  const [change] = await t.db.select().from(changes).limit(1);
  const [logger] = await t.db.select().from(instruments).where(eq(instruments.channelCount, 8)).limit(1);
  ids = { workOrderId: wo.id, changeId: change.id, instrumentId: logger.id, ovenId: oven.id };
});
afterAll(() => {
  t.close();
  fs.rmSync(sandbox, { recursive: true, force: true });
});

type Handler = (req: Request, ctx: { params: Promise<Record<string, string>> }) => Promise<Response>;
async function call(file: string, method: string, params: Record<string, string>, role: Role, body?: FormData) {
  const mod = (await import(path.resolve(__dirname, "../../app", file))) as Record<string, Handler>;
  return mod[method](new Request(`http://localhost/x`, { method, headers: { authorization: `Bearer ${tokens[role]}` }, body }), { params: Promise.resolve(params) });
}
const form = (field: string, bytes: Uint8Array, name: string, type: string, fields: Record<string, string> = {}) => {
  const f = new FormData();
  for (const [k, v] of Object.entries(fields)) f.append(k, v);
  f.append(field, new File([bytes as BlobPart], name, { type }));
  return f;
};

/** The upload routes: where the file goes, who may send it, and what each accepts. */
type Upload = { label: string; file: string; params: Record<string, string>; field: string; role: Role; fields: Record<string, string> };
const UPLOADS = (): Upload[] => [
  { label: "work-order photo", file: "api/v1/work-orders/[workOrderId]/attachments/route.ts", params: { workOrderId: String(ids.workOrderId) }, field: "file", role: "technician" as Role, fields: {} },
  { label: "change photo", file: "api/v1/changes/[changeId]/attachments/route.ts", params: { changeId: String(ids.changeId) }, field: "file", role: "engineer" as Role, fields: {} },
  {
    label: "calibration certificate", file: "api/v1/instruments/[instrumentId]/calibrations/route.ts", params: { instrumentId: String(ids.instrumentId) }, field: "certificate", role: "engineer" as Role,
    fields: { performedAt: "2026-02-01", performedBy: "Kestrel Metrology", reference: "dry-well", offsets: '{"1": 0.1}' },
  },
];

/** Every file under a folder, relative to it. */
const listFiles = (dir: string): string[] => (fs.existsSync(dir) ? (fs.readdirSync(dir, { recursive: true }) as string[]).filter((f) => fs.statSync(path.join(dir, f)).isFile()) : []);

function expectStoreIntact() {
  // Nothing beside UPLOAD_DIR: a name like ../../x would have put a file in a/b, a or the sandbox.
  expect(fs.readdirSync(sandbox)).toEqual(["a"]);
  expect(fs.readdirSync(path.join(sandbox, "a"))).toEqual(["b"]);
  expect(fs.readdirSync(path.join(sandbox, "a", "b"))).toEqual(["uploads"]);
  for (const rel of listFiles(uploadDir)) {
    const bytes = fs.readFileSync(path.join(uploadDir, rel));
    expect(path.basename(rel), `${rel} is not named by its SHA-256`).toBe(crypto.createHash("sha256").update(bytes).digest("hex"));
  }
}

describe("the bytes decide what a file is", () => {
  it("accepts a real PNG whatever it is called or claims to be, and serves it back as a PNG", async () => {
    for (const u of UPLOADS()) {
      const res = await call(u.file, "POST", u.params, u.role, form(u.field, PNG, "totally-a-program.exe", "application/x-msdownload", u.fields));
      expect(res.status, `${u.label}: ${await res.clone().text()}`).toBe(201);
    }
    const [a] = await (await import("@/db/queries/work-order-extras")).listAttachments(t.db, ids.workOrderId);
    const served = await call("api/v1/attachments/[attachmentId]/route.ts", "GET", { attachmentId: String(a.id) }, "viewer");
    expect(served.headers.get("content-type")).toBe("image/png");
    expect(served.headers.get("x-content-type-options")).toBe("nosniff");
    expect(served.headers.get("content-disposition")).toBe('inline; filename="totally-a-program.exe"');
    expectStoreIntact();
  });

  it("refuses HTML, SVG and programs dressed as photos or PDFs (415), storing nothing", async () => {
    const before = listFiles(uploadDir).length;
    for (const u of UPLOADS()) {
      for (const [bytes, name, type] of [[HTML, "photo.png", "image/png"], [SVG, "scan.pdf", "application/pdf"], [EXE, "photo.jpg", "image/jpeg"]] as const) {
        const res = await call(u.file, "POST", u.params, u.role, form(u.field, bytes, name, type, u.fields));
        expect(res.status, `${u.label} ${name}`).toBe(415);
        expect((await res.json()).error.code).toBe("unsupported_file");
      }
    }
    expect(listFiles(uploadDir).length).toBe(before);
  });

  it("a PDF certificate named .png is stored and served as a PDF, as an attachment", async () => {
    const u = UPLOADS()[2];
    const res = await call(u.file, "POST", u.params, u.role, form(u.field, PDF, "certificate.png", "image/png", u.fields));
    expect(res.status).toBe(201);
    const { id } = await res.json();
    const served = await call("api/v1/calibrations/[calibrationId]/certificate/route.ts", "GET", { calibrationId: String(id) }, "viewer");
    expect(served.headers.get("content-type")).toBe("application/pdf");
    expect(served.headers.get("content-disposition")).toBe(`attachment; filename="calibration-${id}.pdf"`);
  });

  it("logger files are judged by decoding them: a CSV called photo.png is a run; a PNG called run.csv is not", async () => {
    const runs = "api/v1/ovens/[ovenId]/runs/route.ts";
    const ok = await call(runs, "POST", { ovenId: String(ids.ovenId) }, "technician", form("file", CSV, "photo.png", "image/png"));
    expect(ok.status, await ok.clone().text()).toBe(201);
    const refused = await call(runs, "POST", { ovenId: String(ids.ovenId) }, "technician", form("file", PNG, "run.csv", "text/csv"));
    expect(refused.status).toBe(415);
    // The original file comes back as the text it is, not as the type the uploader claimed.
    const html = await call(runs, "POST", { ovenId: String(ids.ovenId) }, "technician", form("file", CSV, "../../run.html", "text/html"));
    const { id } = await html.json();
    const file = await call("api/v1/runs/[runId]/file/route.ts", "GET", { runId: String(id) }, "viewer");
    expect(file.headers.get("content-type")).toBe("text/csv; charset=utf-8");
    expect(file.headers.get("content-disposition")).toBe('attachment; filename=".._.._run.html"');
    expect(new Uint8Array(await file.arrayBuffer())).toEqual(CSV);
    expectStoreIntact();
  });
});

describe("the forms' server actions check files the same way", () => {
  it("a change with an SVG called photo.png, and a calibration with HTML called cert.pdf, are refused whole", async () => {
    const engineer = await actorFor(t.db, "engineer");
    const changesBefore = (await t.db.select().from(changes)).length;
    const change = await runAction(createChangeDef, engineer, form("attachment", SVG, "photo.png", "image/png", { ovenId: String(ids.ovenId), at: "2026-02-01T08:00:00Z", area: "baffle", summary: "Baffle plate swapped", after: "plate C" }), t.db);
    expect(change).toMatchObject({ ok: false, code: "unsupported_file" });
    expect((await t.db.select().from(changes)).length).toBe(changesBefore);
    const cal = await runAction(createCalibrationDef, engineer, form("certificate", HTML, "cert.pdf", "application/pdf", { instrumentId: String(ids.instrumentId), ...UPLOADS()[2].fields }), t.db);
    expect(cal).toMatchObject({ ok: false, code: "unsupported_file" });
    const ok = await runAction(createChangeDef, engineer, form("attachment", PNG, "../../../evil.sh", "text/x-shellscript", { ovenId: String(ids.ovenId), at: "2026-02-01T09:00:00Z", area: "baffle", summary: "Baffle photo", after: "plate C" }), t.db);
    expect(ok, JSON.stringify(ok)).toMatchObject({ ok: true });
    expectStoreIntact();
  });
});

describe("no name or id reaches outside UPLOAD_DIR", () => {
  it("hostile file names on every upload route leave only hash-named files inside UPLOAD_DIR", async () => {
    const bytes = fc.tuple(fc.constantFrom(PNG, PDF), fc.uint8Array({ maxLength: 64 })).map(([head, tail]) => Uint8Array.from([...head, ...tail]));
    await fc.assert(
      // (An empty name makes the part a plain field, as for an empty file input: a 400, tested by the fuzzing.)
      fc.asyncProperty(fc.constantFrom(...UPLOADS()), hostileFileName.filter((n) => n !== ""), bytes, async (u, name, b) => {
        const res = await call(u.file, "POST", u.params, u.role, form(u.field, b, name, "image/png", u.fields));
        expect(res.status, await res.clone().text()).toBe(201);
        const saved = await res.json();
        if (typeof saved.fileName === "string") expect(saved.fileName).toMatch(/^[\w.\- ]*$/);
      }),
      { numRuns: 40 },
    );
    expectStoreIntact();
    expect(fs.existsSync("/etc/passwd.png")).toBe(false);
  });

  it("download routes answer 404 to ids that are not plain numbers", async () => {
    const routes = [
      ["api/v1/attachments/[attachmentId]/route.ts", "attachmentId"],
      ["api/v1/change-attachments/[attachmentId]/route.ts", "attachmentId"],
      ["api/v1/calibrations/[calibrationId]/certificate/route.ts", "calibrationId"],
      ["api/v1/runs/[runId]/file/route.ts", "runId"],
    ];
    for (const [file, param] of routes) {
      for (const id of ["../../../../etc/passwd", "..%2F..%2Fetc%2Fpasswd", "0x1", "1e0", " 1", "-1", "1/../1"]) {
        const res = await call(file, "GET", { [param]: id }, "viewer");
        expect(res.status, `${file} ${id}`).toBe(404);
      }
    }
  });
});
