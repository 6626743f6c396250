import { getDb } from "@/db";
import { listSitesWithLines } from "@/db/queries/sites";
import { PageHeader } from "@/components/ui/page-header";
import { requirePermission } from "@/lib/session";
import { LineForm, SiteForm } from "./site-forms";

export const metadata = { title: "Sites and lines" };

export default async function SitesPage() {
  await requirePermission("site.manage");
  const sites = await listSitesWithLines(await getDb());
  return (
    <>
      <PageHeader title="Sites and lines" subtitle="Each site has a time zone; its lines hold the ovens." />
      <div className="space-y-4">
        <SiteForm />
        {sites.length ? <LineForm sites={sites.map((s) => ({ id: s.id, name: s.name }))} /> : null}
      </div>
      <ul className="mt-8 grid gap-3">
        {sites.map((s) => (
          <li key={s.id} className="card p-4">
            <p className="font-semibold">{s.name}</p>
            <p className="text-sm text-ink-muted">{s.timeZone}</p>
            <ul className="mt-2 list-disc pl-5 text-sm">
              {s.lines.map((l) => (
                <li key={l.id}>
                  {l.name} <span className="text-ink-muted">({l.kind})</span>
                </li>
              ))}
            </ul>
          </li>
        ))}
      </ul>
    </>
  );
}
