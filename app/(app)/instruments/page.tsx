import Link from "next/link";
import { getDb } from "@/db";
import { listInstruments } from "@/db/queries/instruments";
import { CalibrationBadge } from "@/components/runs/calibration-badge";
import { PageHeader } from "@/components/ui/page-header";
import { requirePermission } from "@/lib/session";
import { can } from "@/lib/permissions";
import { NewInstrumentForm } from "./instrument-forms";

export const metadata = { title: "Instruments" };

export default async function InstrumentsPage() {
  const actor = await requirePermission("run.read");
  const rows = await listInstruments(await getDb());
  return (
    <>
      <PageHeader title="Instruments" subtitle="Loggers and probe sets, with their calibration: valid, due within 30 days, or lapsed." />
      <div className="card overflow-x-auto" tabIndex={0} role="region" aria-label="List">
        <table className="w-full min-w-[40rem] text-sm">
          <thead className="text-left text-xs text-ink-muted">
            <tr><th className="px-3 py-2">Instrument</th><th className="px-3 py-2">Kind</th><th className="px-3 py-2">Serial</th><th className="px-3 py-2 text-right">Skew s</th><th className="px-3 py-2">Calibration</th><th className="px-3 py-2">Due</th></tr>
          </thead>
          <tbody>
            {rows.map(({ instrument: i, latest, state }) => (
              <tr key={i.id} className="border-t border-paper-line">
                <td className="px-3 py-2"><Link href={`/instruments/${i.id}`} className="font-medium underline decoration-paper-line underline-offset-4">{i.name}</Link></td>
                <td className="px-3 py-2">{i.kind === "logger" ? `Logger, ${i.channelCount} ch` : `Probe set${i.thermocoupleType ? `, type ${i.thermocoupleType}` : ""}`}</td>
                <td className="num px-3 py-2">{i.serial}</td>
                <td className="num px-3 py-2 text-right">{i.scanSkewSeconds}</td>
                <td className="px-3 py-2"><CalibrationBadge state={state} /></td>
                <td className="num px-3 py-2">{latest ? latest.dueAt.toISOString().slice(0, 10) : "—"}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {can(actor.role, "instrument.manage") ? (
        <section className="card mt-6 p-4">
          <h2 className="mb-3 font-semibold">Add an instrument</h2>
          <NewInstrumentForm />
        </section>
      ) : null}
    </>
  );
}
