"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";
import { useState } from "react";
import type { NavItem } from "@/lib/roles";

/** Role-aware navigation: a bar on wide screens, a menu button on a phone. */
export function MainNav({ items }: { items: NavItem[] }) {
  const pathname = usePathname();
  const [open, setOpen] = useState(false);
  const matches = (href: string) => pathname === href || pathname.startsWith(href + "/");
  // With nested areas (/people and /people/audit) only the most specific match is the current page.
  const current = items.filter((item) => matches(item.href)).sort((a, b) => b.href.length - a.href.length)[0]?.href;
  const isCurrent = (href: string) => href === current;

  const links = items.map((item) => (
    <li key={item.href}>
      <Link
        href={item.href}
        onClick={() => setOpen(false)}
        aria-current={isCurrent(item.href) ? "page" : undefined}
        className={`flex min-h-touch items-center rounded-md px-3 font-semibold text-white hover:bg-white/15 aria-[current=page]:bg-white aria-[current=page]:text-thread-800`}
      >
        {item.label}
      </Link>
    </li>
  ));

  return (
    <nav aria-label="Main" className="no-print">
      <button
        type="button"
        className="btn btn-secondary border-white/60 text-white lg:hidden"
        aria-expanded={open}
        aria-controls="main-nav-list"
        onClick={() => setOpen((value) => !value)}
      >
        <span aria-hidden="true">☰</span> Menu
      </button>
      <ul
        id="main-nav-list"
        className={`${open ? "flex" : "hidden"} absolute left-0 right-0 top-full z-20 flex-col gap-1 bg-thread-800 p-3 shadow-lg lg:static lg:flex lg:flex-row lg:flex-wrap lg:bg-transparent lg:p-0 lg:shadow-none`}
      >
        {links}
      </ul>
    </nav>
  );
}
