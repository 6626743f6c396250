import Link from "next/link";
import { loadOvenForPage } from "@/db/queries/oven-page";
import { ServiceStateBadge } from "@/components/oven/service-state-badge";
import { buttonClass } from "@/components/ui/button";
import { requirePermission } from "@/lib/session";
import { can } from "@/lib/permissions";
import { OVEN_KIND_LABELS } from "@/lib/validation/oven";
import { OvenSectionTabs } from "./section-tabs";
import { HealthBadge } from "@/components/oven/health-badge";
import { getStoredHealth } from "@/db/queries/health";
import { getDb } from "@/db";

export default async function OvenLayout({ children, params }: { children: React.ReactNode; params: Promise<{ ovenId: string }> }) {
  const actor = await requirePermission("oven.read");
  const { ovenId } = await params;
  const { oven, line, site } = await loadOvenForPage(ovenId);
  const health = await getStoredHealth(await getDb(), oven.id);
  return (
    <>
      <nav aria-label="Breadcrumb" className="no-print mb-2 text-sm text-ink-muted">
        <Link href="/fleet" className="underline">
          Fleet
        </Link>{" "}
        / {line.name}
      </nav>
      <header className="mb-4 flex flex-wrap items-start justify-between gap-3">
        <div>
          <h1 className="flex flex-wrap items-center gap-3 text-2xl font-semibold tracking-tight">
            <span className="tracking-wide">{oven.tag}</span>
            {health ? <HealthBadge state={health.state} /> : null}
            <ServiceStateBadge state={oven.serviceState} />
          </h1>
          <p className="mt-1 text-sm text-ink-muted">
            {oven.name} · {OVEN_KIND_LABELS[oven.kind]} · {line.name}, {site.name}
          </p>
          {health && health.state !== "steady" ? (
            <p className="mt-1 text-sm font-medium text-ink" data-testid="health-sentence">
              {health.state === "watch" ? "Watch" : health.state === "act" ? "Act" : "Down"} — {health.reasons[0]}
            </p>
          ) : null}
        </div>
        <div className="no-print flex flex-wrap gap-2">
          {/* A full page load: the label page has no shell, and a client-side move between the two
              route groups under /ovens/[ovenId] left the browser where it was. */}
          <a href={`/ovens/${oven.id}/label`} className={buttonClass("secondary")}>
            QR label
          </a>
          {can(actor.role, "oven.update") ? (
            <Link href={`/ovens/${oven.id}/edit`} className={buttonClass("secondary")}>
              Edit oven
            </Link>
          ) : null}
        </div>
      </header>
      <OvenSectionTabs ovenId={oven.id} />
      <div className="mt-6">{children}</div>
    </>
  );
}
