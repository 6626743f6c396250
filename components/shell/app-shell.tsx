import Link from "next/link";
import type { ReactNode } from "react";
import { OvenwardLogo } from "@/components/brand/logo";
import type { Actor } from "@/lib/actor";
import { can } from "@/lib/permissions";
import { ROLE_LABELS } from "@/lib/permissions";
import { env } from "@/lib/env";
import { NavLinks, type NavItem } from "./nav-links";
import { signOutAction } from "./actions";

function navFor(actor: Actor): { main: NavItem[]; admin: NavItem[] } {
  // Floor work first, then the measurement, then planning; each entry only where the role may read it.
  const main: NavItem[] = [{ href: "/fleet", label: "Fleet" }];
  if (can(actor.role, "workorder.update")) main.push({ href: "/my-work", label: "My work" });
  if (can(actor.role, "alert.read")) main.push({ href: "/alerts", label: "Alerts" });
  if (can(actor.role, "run.read")) main.push({ href: "/runs", label: "Runs" });
  if (can(actor.role, "change.read")) main.push({ href: "/changes", label: "Changes" });
  if (can(actor.role, "maintenance.read")) {
    main.push({ href: "/work-orders", label: "Work orders" }, { href: "/calendar", label: "Calendar" }, { href: "/plans", label: "Plans" });
    main.push({ href: "/maintenance/kpis", label: "Maintenance KPIs" });
  }
  if (can(actor.role, "run.read")) main.push({ href: "/windows", label: "Windows" }, { href: "/instruments", label: "Instruments" });
  if (can(actor.role, "subscription.manage.own")) main.push({ href: "/settings/notifications", label: "E-mail settings" });
  const admin: NavItem[] = [];
  if (can(actor.role, "user.manage")) admin.push({ href: "/settings/people", label: "People" });
  if (can(actor.role, "site.manage")) admin.push({ href: "/settings/sites", label: "Sites and lines" });
  if (can(actor.role, "token.manage")) admin.push({ href: "/settings/tokens", label: "API tokens" });
  if (can(actor.role, "outbox.manage")) admin.push({ href: "/settings/outbox", label: "Outbox" });
  if (can(actor.role, "mail.sink.read") && env().SMTP_SINK === "on") admin.push({ href: "/dev/mail", label: "Captured mail" });
  return { main, admin };
}

function UserBlock({ actor }: { actor: Actor }) {
  return (
    <div className="flex items-center justify-between gap-2 border-t border-paper-line pt-3">
      <div className="min-w-0 text-sm">
        <p className="truncate font-medium text-ink">{actor.name ?? actor.email}</p>
        <p className="text-xs text-ink-muted">{ROLE_LABELS[actor.role]}</p>
      </div>
      <form action={signOutAction}>
        <button className="min-h-11 rounded-lg px-3 text-sm font-medium text-ink-soft hover:bg-paper-sunk">Sign out</button>
      </form>
    </div>
  );
}

export function AppShell({ actor, children }: { actor: Actor; children: ReactNode }) {
  const nav = navFor(actor);
  return (
    <div className="min-h-dvh md:grid md:grid-cols-[15rem_1fr]">
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:z-50 focus:rounded focus:bg-paper-raised focus:px-3 focus:py-2">
        Skip to content
      </a>
      {/* Laptop: a quiet sidebar. */}
      <aside className="no-print hidden border-r border-paper-line bg-paper-sunk/60 md:flex md:min-h-dvh md:flex-col md:gap-6 md:p-4">
        <Link href="/fleet" aria-label="Ovenward, go to the fleet">
          <OvenwardLogo />
        </Link>
        <nav aria-label="Main" className="flex-1 space-y-6">
          <NavLinks items={nav.main} orientation="vertical" />
          {nav.admin.length ? (
            <div>
              <p className="px-3 pb-1 text-xs font-semibold uppercase tracking-wider text-ink-muted">Administration</p>
              <NavLinks items={nav.admin} orientation="vertical" />
            </div>
          ) : null}
        </nav>
        <UserBlock actor={actor} />
      </aside>
      {/* Phone: a top bar with a menu that opens in place (no script needed). */}
      <header className="no-print sticky top-0 z-30 border-b border-paper-line bg-paper/95 backdrop-blur md:hidden">
        <details className="group">
          <summary className="flex min-h-14 cursor-pointer list-none items-center justify-between px-4 [&::-webkit-details-marker]:hidden">
            <OvenwardLogo />
            <span className="rounded-lg border border-paper-line px-3 py-2 text-sm font-medium">
              <span className="group-open:hidden">Menu</span>
              <span className="hidden group-open:inline">Close</span>
            </span>
          </summary>
          <nav aria-label="Main" className="border-t border-paper-line bg-paper-raised px-2 pb-3">
            <NavLinks items={[...nav.main, ...nav.admin]} orientation="horizontal" />
            <div className="px-3">
              <UserBlock actor={actor} />
            </div>
          </nav>
        </details>
      </header>
      <main id="main" className="mx-auto w-full max-w-6xl px-4 py-6 md:px-8 md:py-8">
        {children}
      </main>
    </div>
  );
}
