import Link from "next/link";
import { getDb } from "@/db";
import { listWindows } from "@/db/queries/windows";
import { PageHeader } from "@/components/ui/page-header";
import { buttonClass } from "@/components/ui/button";
import { requirePermission } from "@/lib/session";
import { can } from "@/lib/permissions";

export const metadata = { title: "Process windows" };

export default async function WindowsPage() {
  const actor = await requirePermission("run.read");
  const windows = await listWindows(await getDb());
  return (
    <>
      <PageHeader
        title="Process windows"
        subtitle="The limits runs are judged against. Editing a window makes a new version; runs keep the values they were judged with."
        actions={
          <>
            <Link href="/windows/boards" className={buttonClass("secondary")}>Test boards</Link>
            {can(actor.role, "window.manage") ? <Link href="/windows/new" className={buttonClass("primary")}>New window</Link> : null}
          </>
        }
      />
      <div className="card overflow-x-auto" tabIndex={0} role="region" aria-label="List">
        <table className="w-full min-w-[40rem] text-sm">
          <thead className="text-left text-xs text-ink-muted">
            <tr><th className="px-3 py-2">Name</th><th className="px-3 py-2">Version</th><th className="px-3 py-2 text-right">Peak °C</th><th className="px-3 py-2 text-right">TAL s</th><th className="px-3 py-2 text-right">ΔT max °C</th><th className="px-3 py-2">From preset</th></tr>
          </thead>
          <tbody>
            {windows.map((w) => (
              <tr key={w.id} className="border-t border-paper-line">
                <td className="px-3 py-2"><Link href={`/windows/${w.id}`} className="font-medium underline decoration-paper-line underline-offset-4">{w.name}</Link></td>
                <td className="num px-3 py-2">{w.version}</td>
                <td className="num px-3 py-2 text-right">{w.values.peakMin}–{w.values.peakMax}</td>
                <td className="num px-3 py-2 text-right">{w.values.talMin}–{w.values.talMax}</td>
                <td className="num px-3 py-2 text-right">{w.values.deltaTMax}</td>
                <td className="px-3 py-2 text-ink-muted">{w.presetId ?? "—"}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </>
  );
}
