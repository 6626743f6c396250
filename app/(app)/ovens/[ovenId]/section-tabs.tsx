"use client";
import Link from "next/link";
import { usePathname } from "next/navigation";

const SECTIONS = [
  { slug: "health", label: "Health" },
  { slug: "runs", label: "Runs" },
  { slug: "changes", label: "Changes" },
  { slug: "maintenance", label: "Maintenance" },
  { slug: "setup", label: "Setup" },
];

export function OvenSectionTabs({ ovenId }: { ovenId: number }) {
  const path = usePathname();
  return (
    <nav aria-label="Oven sections" className="no-print -mx-4 overflow-x-auto border-b border-paper-line px-4 md:mx-0 md:px-0">
      <ul className="flex min-w-max gap-1">
        {SECTIONS.map((s) => {
          const href = `/ovens/${ovenId}/${s.slug}`;
          const active = path === href || path.startsWith(href + "/");
          return (
            <li key={s.slug}>
              <Link
                href={href}
                aria-current={active ? "page" : undefined}
                className={`flex min-h-11 items-center border-b-2 px-3 text-sm font-medium ${active ? "border-ember text-ink" : "border-transparent text-ink-muted hover:text-ink"}`}
              >
                {s.label}
              </Link>
            </li>
          );
        })}
      </ul>
    </nav>
  );
}
