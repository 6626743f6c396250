import { getDb } from "@/db";
import { listSitesWithLines } from "@/db/queries/sites";
import { loadOvenForPage } from "@/db/queries/oven-page";
import { OvenForm } from "@/components/oven/oven-form";
import { requirePermission } from "@/lib/session";
import { can } from "@/lib/permissions";
import { updateOvenAction } from "../../actions";

export const metadata = { title: "Edit oven" };

export default async function EditOvenPage({ params }: { params: Promise<{ ovenId: string }> }) {
  const actor = await requirePermission("oven.update");
  const { oven } = await loadOvenForPage((await params).ovenId);
  const sites = await listSitesWithLines(await getDb());
  const lines = sites.flatMap((s) => s.lines.map((l) => ({ id: l.id, label: `${l.name} · ${s.name}` })));
  const initial = Object.fromEntries(
    Object.entries({ tag: oven.tag, name: oven.name, lineId: oven.lineId, kind: oven.kind, zones: oven.zones, maker: oven.maker, model: oven.model, serial: oven.serial, installedOn: oven.installedOn, serviceState: oven.serviceState, notes: oven.notes }).map(([k, v]) => [k, v == null ? "" : String(v)]),
  );
  return (
    <>
      <h2 className="mb-4 text-lg font-semibold">Edit {oven.tag}</h2>
      <OvenForm action={updateOvenAction} lines={lines} initial={initial} ovenId={oven.id} canRetire={can(actor.role, "oven.retire")} />
    </>
  );
}
