import { loadOvenForPage } from "@/db/queries/oven-page";
import { OVEN_KIND_LABELS, SERVICE_STATE_LABELS } from "@/lib/validation/oven";
import { formatDateTime } from "@/lib/format";
import { currentConfiguration } from "@/db/queries/changes";
import { CHANGE_AREA_LABELS } from "@/lib/validation/change";
import { getDb } from "@/db";
import { runChoices } from "@/db/queries/run-options";
import { getActor } from "@/lib/session";
import { can } from "@/lib/permissions";
import Link from "next/link";
import { OvenDefaultsForm } from "./defaults-form";

export const metadata = { title: "Setup" };

function Row({ label, value }: { label: string; value: React.ReactNode }) {
  return (
    <div className="grid grid-cols-[9rem_1fr] gap-3 border-b border-paper-line py-2 last:border-0">
      <dt className="text-sm text-ink-muted">{label}</dt>
      <dd className="text-sm">{value ?? <span className="text-ink-faint">not recorded</span>}</dd>
    </div>
  );
}

export default async function OvenSetup({ params }: { params: Promise<{ ovenId: string }> }) {
  const { oven, line, site } = await loadOvenForPage((await params).ovenId);
  const [choices, actor, config] = await Promise.all([runChoices(await getDb()), getActor(), currentConfiguration(await getDb(), oven.id)]);
  const windowName = choices.windows.find((w) => w.id === oven.defaultWindowId)?.label ?? "built-in SAC305 window";
  const boardName = choices.boards.find((b) => b.id === oven.defaultBoardId)?.label ?? null;
  return (
    <div className="grid gap-6 lg:grid-cols-2">
      <section className="card p-5" aria-labelledby="data-heading">
        <h2 id="data-heading" className="mb-2 font-semibold">
          Oven data
        </h2>
        <dl>
          <Row label="Tag" value={oven.tag} />
          <Row label="Name" value={oven.name} />
          <Row label="Kind" value={OVEN_KIND_LABELS[oven.kind]} />
          <Row label="Heating zones" value={oven.zones ? <span className="num">{oven.zones}</span> : null} />
          <Row label="Maker" value={oven.maker} />
          <Row label="Model" value={oven.model} />
          <Row label="Serial number" value={oven.serial ? <span className="num">{oven.serial}</span> : null} />
          <Row label="Installed on" value={oven.installedOn ? <span className="num">{oven.installedOn}</span> : null} />
          <Row label="Service state" value={SERVICE_STATE_LABELS[oven.serviceState]} />
          <Row label="Line" value={`${line.name}, ${site.name}`} />
          <Row label="Site time zone" value={site.timeZone} />
          <Row label="Last edited" value={<span className="num">{formatDateTime(oven.updatedAt, site.timeZone)}</span>} />
        </dl>
        {oven.notes ? <p className="mt-3 whitespace-pre-line text-sm text-ink-soft">{oven.notes}</p> : null}
      </section>
      <section className="card p-5" aria-labelledby="config-heading">
        <h2 id="config-heading" className="mb-2 font-semibold">
          Current configuration
        </h2>
        {config.length ? (
          <dl>
            {config.map((c) => (
              <Row
                key={c.area}
                label={CHANGE_AREA_LABELS[c.area]}
                value={
                  <>
                    <span className="font-medium">{c.after}</span>
                    <span className="block text-xs text-ink-muted">since {formatDateTime(c.at, site.timeZone)}</span>
                  </>
                }
              />
            ))}
          </dl>
        ) : (
          <p className="text-sm text-ink-muted">No change has been logged for {oven.tag} yet; its configuration is as delivered.</p>
        )}
        <p className="mt-3 text-xs text-ink-muted">Derived from the modification log: the latest value logged in each area.</p>
      </section>
      <section className="card p-5" aria-labelledby="runs-setup-heading">
        <h2 id="runs-setup-heading" className="mb-2 font-semibold">
          Verification runs
        </h2>
        <dl className="mb-4">
          <Row label="Process window" value={oven.defaultWindowId ? <Link className="underline" href={`/windows/${oven.defaultWindowId}`}>{windowName}</Link> : windowName} />
          <Row label="Test board" value={boardName} />
        </dl>
        {actor && can(actor.role, "window.manage") ? (
          <OvenDefaultsForm ovenId={oven.id} windowId={oven.defaultWindowId} boardId={oven.defaultBoardId} windows={choices.windows} boards={choices.boards.map((b) => ({ id: b.id, label: b.label }))} />
        ) : null}
      </section>
    </div>
  );
}
