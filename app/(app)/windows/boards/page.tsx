import { getDb } from "@/db";
import { listBoards } from "@/db/queries/boards";
import { PageHeader } from "@/components/ui/page-header";
import { probeColour } from "@/components/charts/probe-colours";
import { requirePermission } from "@/lib/session";
import { can } from "@/lib/permissions";
import { NewBoardForm } from "./board-forms";

export const metadata = { title: "Test boards" };

export default async function BoardsPage() {
  const actor = await requirePermission("run.read");
  const boards = await listBoards(await getDb());
  return (
    <>
      <PageHeader title="Test boards" subtitle="Boards with thermocouples at known positions. Runs map logger columns to these positions." />
      <div className="grid gap-6 lg:grid-cols-[1fr_22rem]">
        <ul className="grid gap-4 md:grid-cols-2">
          {boards.map((b) => {
            const r = Math.max(b.widthMm, b.heightMm) * 0.03;
            return (
              <li key={b.id} className="card space-y-2 p-4">
                <h2 className="font-semibold">{b.name}</h2>
                <p className="text-xs text-ink-muted"><span className="num">{b.widthMm} × {b.heightMm}</span> mm · {b.probes.length} probes</p>
                <svg viewBox={`${-r * 2} ${-r * 2} ${b.widthMm + r * 4} ${b.heightMm + r * 4}`} className="w-full" role="img" aria-label={`Outline of ${b.name} with ${b.probes.length} probe positions`}>
                  <rect width={b.widthMm} height={b.heightMm} rx={2} fill="#f3efe6" stroke="#3d454d" strokeWidth={0.8} />
                  {b.probes.map((p, i) => (
                    <g key={p.label}>
                      <title>{`${p.label}: ${p.sitsOn}`}</title>
                      <circle cx={p.x} cy={p.y} r={r} fill="#fff" stroke={probeColour(i)} strokeWidth={r * 0.4} />
                      <text x={p.x} y={p.y - r * 1.5} textAnchor="middle" fontSize={r * 1.1}>{p.label}</text>
                    </g>
                  ))}
                </svg>
                <ul className="text-xs text-ink-soft">{b.probes.map((p) => <li key={p.label}><span className="font-medium">{p.label}</span> — {p.sitsOn || "no description"} <span className="num text-ink-muted">({p.x}, {p.y} mm)</span></li>)}</ul>
              </li>
            );
          })}
        </ul>
        {can(actor.role, "board.manage") ? (
          <section className="card h-fit p-4">
            <h2 className="mb-2 font-semibold">Add a test board</h2>
            <NewBoardForm />
          </section>
        ) : null}
      </div>
    </>
  );
}
