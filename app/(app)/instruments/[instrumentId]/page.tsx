import Link from "next/link";
import { notFound } from "next/navigation";
import { getDb } from "@/db";
import { calibrationState, getInstrument, latestCalibrationAt, listCalibrations } from "@/db/queries/instruments";
import { CalibrationBadge } from "@/components/runs/calibration-badge";
import { PageHeader } from "@/components/ui/page-header";
import { requirePermission } from "@/lib/session";
import { can } from "@/lib/permissions";
import { TOLERANCE_CLASS_LABELS } from "@/lib/validation/instruments";
import { CalibrationForm } from "../instrument-forms";

export const metadata = { title: "Instrument" };

export default async function InstrumentPage({ params }: { params: Promise<{ instrumentId: string }> }) {
  const actor = await requirePermission("run.read");
  const id = Number((await params).instrumentId);
  const db = await getDb();
  const i = Number.isInteger(id) && id > 0 ? await getInstrument(db, id) : null;
  if (!i) notFound();
  const now = new Date();
  const [cals, latest] = await Promise.all([listCalibrations(db, id), latestCalibrationAt(db, id, now)]);
  return (
    <>
      <nav aria-label="Breadcrumb" className="mb-2 text-sm text-ink-muted"><Link href="/instruments" className="underline">Instruments</Link></nav>
      <PageHeader title={i.name} subtitle={`${i.kind === "logger" ? "Data logger" : "Probe set"} · serial ${i.serial} · ${i.channelCount} channels`} actions={<CalibrationBadge state={calibrationState(latest, now)} />} />
      <dl className="card mb-6 grid gap-x-6 p-4 text-sm sm:grid-cols-2">
        {[
          ["Scan skew", `${i.scanSkewSeconds} s between channels`],
          ["Resolution", i.resolution !== null ? `${i.resolution} °C` : "—"],
          ["Accuracy", i.accuracy !== null ? `± ${i.accuracy} °C` : "—"],
          ["Thermocouples", i.thermocoupleType ? `type ${i.thermocoupleType}${i.toleranceClass ? `, ${TOLERANCE_CLASS_LABELS[i.toleranceClass as keyof typeof TOLERANCE_CLASS_LABELS] ?? i.toleranceClass}` : ""}` : "—"],
        ].map(([k, v]) => (
          <div key={k} className="flex justify-between gap-2 border-b border-paper-line py-1.5"><dt className="text-ink-muted">{k}</dt><dd className="num">{v}</dd></div>
        ))}
      </dl>
      <section className="card mb-6 overflow-x-auto p-4" tabIndex={0} aria-label="Calibrations">
        <h2 className="mb-2 font-semibold">Calibrations</h2>
        <table className="w-full min-w-[36rem] text-sm">
          <thead className="text-left text-xs text-ink-muted"><tr><th className="py-1">Calibrated</th><th>Due</th><th>By</th><th>Reference</th><th className="text-right">U (k=2) °C</th><th>Offsets °C</th><th>Certificate</th></tr></thead>
          <tbody>
            {cals.map((c) => (
              <tr key={c.id} className="border-t border-paper-line align-top">
                <td className="num py-1.5">{c.performedAt.toISOString().slice(0, 10)}</td>
                <td className="num">{c.dueAt.toISOString().slice(0, 10)}</td>
                <td>{c.performedBy}</td>
                <td className="max-w-48 text-xs">{c.reference}</td>
                <td className="num text-right">{c.expandedUncertainty ?? "—"}</td>
                <td className="num text-xs">{Object.entries(c.offsets).map(([ch, v]) => `${ch}: ${v >= 0 ? "+" : ""}${v}`).join(" · ") || "none"}</td>
                <td>{c.certificateSha256 ? <a className="underline" href={`/api/v1/calibrations/${c.id}/certificate`}>download</a> : "—"}</td>
              </tr>
            ))}
            {cals.length === 0 ? <tr><td colSpan={7} className="py-3 text-ink-muted">No calibration recorded yet.</td></tr> : null}
          </tbody>
        </table>
      </section>
      {can(actor.role, "instrument.manage") ? (
        <section className="card p-4">
          <h2 className="mb-3 font-semibold">Record a calibration</h2>
          <CalibrationForm instrumentId={i.id} channels={i.channelCount} />
        </section>
      ) : null}
    </>
  );
}
