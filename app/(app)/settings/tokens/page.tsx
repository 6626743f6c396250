import { getDb } from "@/db";
import { listApiTokens } from "@/db/queries/api-tokens";
import { listUsers } from "@/db/queries/users";
import { PageHeader } from "@/components/ui/page-header";
import { EmptyState } from "@/components/ui/empty-state";
import { requirePermission } from "@/lib/session";
import { formatAgo } from "@/lib/format";
import { CreateTokenForm, RevokeTokenForm } from "./token-forms";

export const metadata = { title: "API tokens" };

export default async function TokensPage() {
  await requirePermission("token.manage");
  const db = await getDb();
  const [tokens, users] = await Promise.all([listApiTokens(db), listUsers(db)]);
  return (
    <>
      <PageHeader
        title="API tokens"
        subtitle={
          <>
            Loggers and scripts send <code>Authorization: Bearer &lt;token&gt;</code>. A token acts for a user with at most that user&apos;s
            role; revoke it and it stops at once.
          </>
        }
      />
      <section className="mb-8">
        <CreateTokenForm users={users.filter((u) => u.active).map((u) => ({ id: u.id, email: u.email }))} />
      </section>
      {tokens.length === 0 ? (
        <EmptyState title="No tokens yet">Create one for each logger or script, so each can be revoked on its own.</EmptyState>
      ) : (
        <ul className="grid gap-2">
          {tokens.map((t) => (
            <li key={t.id} className="card flex flex-wrap items-center justify-between gap-3 p-4">
              <div>
                <p className="font-medium">
                  {t.name} <code className="ml-1 text-xs text-ink-muted">{t.prefix}…</code>
                </p>
                <p className="text-sm text-ink-muted">
                  for {t.email} · {t.role} · created {formatAgo(t.createdAt)} · {t.lastUsedAt ? `last used ${formatAgo(t.lastUsedAt)}` : "never used"}
                </p>
              </div>
              {t.revokedAt ? <span className="text-sm font-semibold text-health-act">Revoked {formatAgo(t.revokedAt)}</span> : <RevokeTokenForm tokenId={t.id} label={t.name} />}
            </li>
          ))}
        </ul>
      )}
    </>
  );
}
