import { getDb } from "@/db";
import { listOvens } from "@/db/queries/ovens";
import { listUsers } from "@/db/queries/users";
import { PageHeader } from "@/components/ui/page-header";
import { requirePermission } from "@/lib/session";
import { can } from "@/lib/permissions";
import { WorkOrderTable } from "./work-order-table";

export const metadata = { title: "Work orders" };

export default async function WorkOrdersPage({ searchParams }: { searchParams: Promise<{ ovenId?: string; overdue?: string }> }) {
  const actor = await requirePermission("maintenance.read");
  const sp = await searchParams;
  const db = await getDb();
  const [ovenRows, people] = await Promise.all([listOvens(db), listUsers(db)]);
  const assignable = people.filter((u) => u.active && ["technician", "engineer", "manager"].includes(u.role)).map((u) => ({ id: u.id, name: u.name ?? u.email }));
  return (
    <>
      <PageHeader title="Work orders" subtitle="Filter on the server, select rows to assign them, or export what you see as CSV." />
      <WorkOrderTable ovens={ovenRows.map((r) => ({ id: r.oven.id, tag: r.oven.tag }))} people={assignable} canAssign={can(actor.role, "workorder.assign")} initialOvenId={sp.ovenId && /^\d+$/.test(sp.ovenId) ? sp.ovenId : ""} initialOverdue={sp.overdue === "true"} />
    </>
  );
}
