"use client";
import Link from "next/link";
import { usePathname } from "next/navigation";

export type NavItem = { href: string; label: string };

export function NavLinks({ items, orientation }: { items: NavItem[]; orientation: "vertical" | "horizontal" }) {
  const path = usePathname();
  return (
    <ul className={orientation === "vertical" ? "flex flex-col gap-1" : "flex flex-col gap-1 p-2"}>
      {items.map((item) => {
        const active = path === item.href || path.startsWith(item.href + "/");
        return (
          <li key={item.href}>
            <Link
              href={item.href}
              aria-current={active ? "page" : undefined}
              className={`flex min-h-11 items-center rounded-lg px-3 text-sm font-medium ${active ? "bg-ember-soft text-ember-strong" : "text-ink-soft hover:bg-paper-sunk"}`}
            >
              {item.label}
            </Link>
          </li>
        );
      })}
    </ul>
  );
}
