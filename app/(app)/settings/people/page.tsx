import { getDb } from "@/db";
import { listUsers } from "@/db/queries/users";
import { PageHeader } from "@/components/ui/page-header";
import { requirePermission } from "@/lib/session";
import { ROLE_LABELS } from "@/lib/permissions";
import { AccessForm, InviteForm } from "./people-forms";

export const metadata = { title: "People" };

export default async function PeoplePage() {
  await requirePermission("user.manage");
  const users = await listUsers(await getDb());
  return (
    <>
      <PageHeader title="People" subtitle="Invite people by e-mail, set their role, and deactivate accounts that should no longer sign in." />
      <section aria-labelledby="invite-heading" className="mb-8">
        <h2 id="invite-heading" className="mb-2 font-semibold">
          Invite someone
        </h2>
        <InviteForm />
      </section>
      <section aria-labelledby="people-heading">
        <h2 id="people-heading" className="mb-2 font-semibold">
          Accounts
        </h2>
        <ul className="grid gap-2">
          {users.map((u) => (
            <li key={u.id} className="card flex flex-col gap-3 p-4 lg:flex-row lg:items-center lg:justify-between">
              <div className="min-w-0">
                <p className="truncate font-medium">
                  {u.name ?? u.email} {u.active ? null : <span className="ml-2 text-xs font-semibold text-health-act">deactivated</span>}
                </p>
                <p className="text-sm text-ink-muted">
                  {u.email} · {ROLE_LABELS[u.role]} {u.passwordHash ? "" : "· invitation not yet accepted"}
                </p>
              </div>
              <AccessForm userId={u.id} role={u.role} active={u.active} email={u.email} />
            </li>
          ))}
        </ul>
      </section>
    </>
  );
}
