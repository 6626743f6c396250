import { parseQuery, withApi } from "@/lib/api";
import { listRunsForExport } from "@/db/queries/run-list";
import { csvLine } from "@/lib/runs/csv";
import { runListQuerySchema } from "@/lib/validation/runs";

const HEADER = [
  "run id", "oven", "run at (UTC)", "verdict", "window use %", "peak min °C", "peak max °C", "ΔT at peak °C", "critical spread °C",
  "TAL min s", "TAL max s", "heat-up rate °C/s", "time to peak max s", "window", "instrument", "calibration", "start",
];

// The filtered runs list as CSV; the same filters as GET /api/v1/runs, without paging.
export const GET = withApi(
  async ({ req, db }) => {
    const q = parseQuery(req, runListQuerySchema);
    const rows = await listRunsForExport(db, q);
    const lines = [csvLine(HEADER)];
    for (const r of rows) {
      lines.push(csvLine([r.id, r.ovenTag, r.runAt, r.verdict, r.windowUse, r.peakMin, r.peakMax, r.deltaTPeak, r.criticalSpread, r.talMin, r.talMax, r.heatUpRate, r.timeToPeakMax, r.windowName, r.instrumentName, r.calibration, r.startState]));
    }
    return new Response("\ufeff" + lines.join("\r\n") + "\r\n", {
      headers: { "content-type": "text/csv; charset=utf-8", "content-disposition": 'attachment; filename="ovenward-runs.csv"' },
    });
  },
  { permission: "run.read", what: "export runs" },
);
