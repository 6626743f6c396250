import { notFound } from "next/navigation";
import { getDb } from "@/db";
import { getWindow, listWindowVersions } from "@/db/queries/windows";
import { PageHeader } from "@/components/ui/page-header";
import { requirePermission } from "@/lib/session";
import { can } from "@/lib/permissions";
import { updateWindowAction } from "../actions";
import { WindowForm } from "../window-form";

export const metadata = { title: "Process window" };

export default async function WindowPage({ params }: { params: Promise<{ windowId: string }> }) {
  const actor = await requirePermission("run.read");
  const id = Number((await params).windowId);
  const db = await getDb();
  const w = Number.isInteger(id) && id > 0 ? await getWindow(db, id) : null;
  if (!w) notFound();
  const versions = await listWindowVersions(db, id);
  const editable = can(actor.role, "window.manage");
  return (
    <>
      <PageHeader title={w.name} subtitle={`Version ${w.version}${w.presetId ? `, from preset ${w.presetId}` : ""}.${editable ? "" : " Only engineers edit windows."}`} />
      <WindowForm action={updateWindowAction} initial={w} windowId={w.id} readOnly={!editable} />
      <section className="card mt-6 p-4">
        <h2 className="mb-2 font-semibold">Versions</h2>
        <ol className="space-y-1 text-sm">
          {versions.map((v) => (
            <li key={v.id} className="num">
              version {v.version} · {v.createdAt.toISOString().slice(0, 10)} · peak {v.values.peakMin}–{v.values.peakMax} °C · TAL {v.values.talMin}–{v.values.talMax} s · ΔT ≤ {v.values.deltaTMax} °C
            </li>
          ))}
        </ol>
      </section>
    </>
  );
}
