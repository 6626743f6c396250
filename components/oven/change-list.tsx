import Link from "next/link";
import type { ChangeListRow } from "@/db/queries/changes";
import { CHANGE_AREA_LABELS } from "@/lib/validation/change";
import { formatDateTime } from "@/lib/format";

// The modification log as a timeline, newest first. Used on the oven page and the fleet-wide list.
type Attachment = { id: number; changeId: number; fileName: string; contentType: string };

export function ChangeList({ rows, timeZone, showOven = false, attachments = [] }: { rows: ChangeListRow[]; timeZone: string; showOven?: boolean; attachments?: Attachment[] }) {
  return (
    <ol className="grid gap-2">
      {rows.map(({ change: c, oven, author }) => (
        <li key={c.id} className="card p-4">
          <div className="flex flex-wrap items-baseline justify-between gap-2">
            <p className="font-semibold">
              {showOven ? <span className="mr-2 tracking-wide">{oven.tag}</span> : null}
              {c.summary}
            </p>
            <time dateTime={c.at.toISOString()} className="num text-sm text-ink-muted">
              {formatDateTime(c.at, timeZone)}
            </time>
          </div>
          <p className="mt-1 text-sm">
            <span className="rounded bg-paper-sunk px-1.5 py-0.5 text-xs font-semibold text-ink-soft">{CHANGE_AREA_LABELS[c.area]}</span>{" "}
            {c.before ? (
              <>
                <span className="text-ink-muted">{c.before}</span> <span aria-label="changed to">→</span>{" "}
              </>
            ) : null}
            <span className="font-medium">{c.after}</span>
          </p>
          {c.reason ? <p className="mt-1 text-sm text-ink-soft">{c.reason}</p> : null}
          {attachments.some((a) => a.changeId === c.id) ? (
            <ul className="mt-2 flex flex-wrap gap-2" aria-label="Photos and documents">
              {attachments
                .filter((a) => a.changeId === c.id)
                .map((a) => (
                  <li key={a.id}>
                    <a href={`/api/v1/change-attachments/${a.id}`} className="inline-flex min-h-11 items-center rounded-lg border border-paper-line px-3 text-sm underline">
                      {a.contentType === "application/pdf" ? "Document" : "Photo"}: {a.fileName}
                    </a>
                  </li>
                ))}
            </ul>
          ) : null}
          <p className="mt-1 flex flex-wrap items-center justify-between gap-2 text-xs text-ink-muted">
            <span>
              Logged by {author?.name ?? author?.email ?? "unknown"}
              {c.workOrderId ? ` · under work order ${c.workOrderId}` : ""}
            </span>
            <Link href={`/changes/${c.id}?metric=${c.area === "controller_firmware" ? "talMin" : "deltaTPeak"}`} className="inline-flex min-h-11 items-center text-sm font-medium text-ember-strong underline">
              Change impact
            </Link>
          </p>
        </li>
      ))}
    </ol>
  );
}
