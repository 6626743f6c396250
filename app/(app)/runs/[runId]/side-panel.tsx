import { CalibrationBadge } from "@/components/runs/calibration-badge";
import { formatDateTime } from "@/lib/format";
import { fmt } from "@/lib/runs/format";
import type { RunDetail } from "@/db/queries/runs";

function Row({ label, children }: { label: string; children: React.ReactNode }) {
  return (
    <div className="grid grid-cols-[8rem_1fr] gap-2 border-b border-paper-line py-1.5 text-sm last:border-0">
      <dt className="text-ink-muted">{label}</dt>
      <dd>{children}</dd>
    </div>
  );
}

/** Conditions, instrument and calibration of a run. */
export function RunSidePanel({ d, timeZone }: { d: RunDetail; timeZone: string }) {
  const r = d.run;
  const setPoints = r.setPoints && !Array.isArray(r.setPoints) ? Object.entries(r.setPoints) : (r.setPoints ?? []).map((v, i) => [`#${i + 1}`, v] as const);
  const offsets = Object.entries(r.offsetsApplied);
  return (
    <aside className="card space-y-4 p-4" aria-label="Conditions and instrument">
      <section>
        <h2 className="mb-1 font-semibold">Conditions</h2>
        <dl>
          <Row label="Start">{r.startState === "cold" ? "Cold start" : r.startState === "hot" ? "Hot start" : "not recorded"}</Row>
          <Row label="Conveyor">{r.conveyorSpeed !== null ? <><span className="num">{fmt(r.conveyorSpeed, 0)}</span> <span className="unit">cm/min</span></> : "not recorded"}</Row>
          <Row label="Set points">
            {setPoints.length ? (
              <span className="num text-xs">{setPoints.map(([k, v]) => `${k} ${v}`).join(" · ")}</span>
            ) : (
              "not recorded"
            )}
          </Row>
          <Row label="Operator">{r.operator ?? "not recorded"}</Row>
          <Row label="Test board">{d.board?.name ?? "none"}</Row>
          {r.notes ? <Row label="Notes">{r.notes}</Row> : null}
        </dl>
      </section>
      <section>
        <h2 className="mb-1 font-semibold">Instrument</h2>
        <dl>
          <Row label="Logger">{d.instrument ? `${d.instrument.name} (${d.instrument.serial})` : "not recorded"}</Row>
          <Row label="Calibration">
            <CalibrationBadge state={r.calibrationStatus} />
            {d.calibration ? <span className="mt-1 block text-xs text-ink-muted">due {formatDateTime(d.calibration.dueAt, timeZone)}</span> : null}
          </Row>
          <Row label="Scan skew">
            <span className="num">{fmt(r.skewSeconds, 2)}</span> <span className="unit">s</span> {r.skewSeconds ? "aligned" : ""}
          </Row>
          <Row label="Offsets">{offsets.length ? <span className="num text-xs">{offsets.map(([k, v]) => `${k} ${v >= 0 ? "+" : ""}${v}`).join(" · ")}</span> : "none applied"}</Row>
        </dl>
        {r.calibrationStatus === "lapsed" ? (
          <p className="mt-2 rounded-lg border border-health-act/40 bg-red-50 p-2 text-xs text-health-act">
            The logger&apos;s calibration had lapsed when this run was made, so its offsets were not applied. Treat these values with care and
            calibrate the logger before relying on it.
          </p>
        ) : null}
      </section>
    </aside>
  );
}
