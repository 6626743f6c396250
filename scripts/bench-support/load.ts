import autocannon, { type Request, type Result } from "autocannon";
import type { Fixtures } from "./databases";
import { loggerCsv, multipartBody } from "./requests";

/**
 * A mixed load from autocannon: each connection goes round the fleet view, the runs list, the
 * work-order list, one work order read then updated (notes, with the version just read), and a
 * run upload — four reads and two writes. (The trend is timed on its own above.)
 */
export async function mixedLoad(base: string, fx: Fixtures, { connections, duration }: { connections: number; duration: number }): Promise<Result> {
  const auth = { authorization: `Bearer ${fx.token}` };
  const boundary = "----ovenward-bench-boundary";
  const upload = multipartBody(boundary, loggerCsv(4242), { startState: "hot", ...(fx.instrumentId ? { instrumentId: String(fx.instrumentId) } : {}) });
  let next = 0;
  const requests: Request[] = [
    { method: "GET", path: "/api/v1/fleet", headers: auth },
    { method: "GET", path: "/api/v1/runs", headers: auth },
    { method: "GET", path: "/api/v1/work-orders", headers: auth },
    {
      method: "GET",
      headers: auth,
      // Each round takes the next open order, so two connections do not edit the same one.
      setupRequest: (req, context) => {
        context.id = fx.openWorkOrders[next++ % fx.openWorkOrders.length];
        return { ...req, path: `/api/v1/work-orders/${context.id}` };
      },
      onResponse: (status, body, context) => {
        if (status === 200) context.version = (JSON.parse(body) as { version: number }).version;
      },
    },
    {
      method: "PATCH",
      headers: { ...auth, "content-type": "application/json" },
      setupRequest: (req, context) => ({ ...req, path: `/api/v1/work-orders/${context.id}`, body: JSON.stringify({ version: context.version, notes: `Checked during a load test, ${new Date().toISOString()}` }) }),
    },
    { method: "POST", path: `/api/v1/ovens/${fx.uploadOvenId}/runs`, headers: { ...auth, "content-type": `multipart/form-data; boundary=${boundary}` }, body: upload },
  ];
  return autocannon({ url: base, connections, duration, requests });
}
