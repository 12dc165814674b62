"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";

/** Whether a menu link is the section the person is in: "/" only on the home page itself. */
export function isCurrentSection(pathname: string, href: string): boolean {
  if (href === "/") return pathname === "/";
  return pathname === href || pathname.startsWith(`${href}/`);
}

/** A main-menu link that marks the current section for sight and for screen readers. */
export function NavItem({ href, label, className }: { href: string; label: string; className: string }) {
  const current = isCurrentSection(usePathname() ?? "", href);
  return (
    <Link href={href} aria-current={current ? "page" : undefined} className={`${className} ${current ? "bg-brand-soft text-brand-strong underline decoration-2 underline-offset-8" : "text-ink no-underline"}`}>
      {label}
    </Link>
  );
}
