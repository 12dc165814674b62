import Link from "next/link";
import { ROLE_LABELS, type Role } from "@/lib/roles";
import { Logo } from "@/components/ui/logo";
import { NavItem } from "./nav-item";
import { linksFor } from "./nav-links";
import { SignOutButton } from "./sign-out-button";

export function AppHeader({ person }: { person: { name: string; roles: readonly Role[] } | null }) {
  const links = person ? linksFor(person.roles) : [];
  return (
    <header className="border-b border-line bg-surface no-print">
      <a href="#main" className="skip-link">
        Skip to main content
      </a>
      <div className="mx-auto flex max-w-6xl items-center justify-between gap-2 px-4 py-3">
        <Link href="/" className="text-ink no-underline" aria-label="Meniscus home">
          <Logo />
        </Link>
        {person ? (
          <>
            <nav aria-label="Main" className="hidden flex-1 md:block">
              <ul className="flex flex-wrap items-center">
                {links.map((l) => (
                  <li key={l.href}>
                    <NavItem href={l.href} label={l.label} className="block rounded-md px-2 py-2 font-semibold hover:bg-brand-soft hover:text-brand-strong" />
                  </li>
                ))}
              </ul>
            </nav>
            <div className="hidden items-center gap-2 md:flex">
              <Link href="/account" className="text-right no-underline text-ink">
                <span className="block text-sm font-semibold leading-tight">{person.name}</span>
                <span className="block text-xs text-muted">{person.roles.map((r) => ROLE_LABELS[r]).join(" · ")}</span>
              </Link>
              <SignOutButton />
            </div>
            <details className="relative md:hidden">
              <summary className="cursor-pointer list-none rounded-md border border-line px-3 py-2 font-semibold">Menu</summary>
              <div className="absolute right-0 z-40 mt-2 w-64 rounded-lg border border-line bg-surface p-3 shadow-lg">
                <p className="font-semibold">{person.name}</p>
                <p className="mb-2 text-sm text-muted">{person.roles.map((r) => ROLE_LABELS[r]).join(" · ")}</p>
                <nav aria-label="Main (phone)">
                  <ul className="flex flex-col">
                    {links.map((l) => (
                      <li key={l.href}>
                        <NavItem href={l.href} label={l.label} className="block rounded-md px-2 py-2 font-semibold hover:bg-brand-soft" />
                      </li>
                    ))}
                    <li>
                      <Link href="/account" className="block rounded-md px-2 py-2 font-semibold text-ink no-underline hover:bg-brand-soft">
                        Account
                      </Link>
                    </li>
                  </ul>
                </nav>
                <div className="mt-2 border-t border-line pt-2">
                  <SignOutButton />
                </div>
              </div>
            </details>
          </>
        ) : (
          <Link href="/sign-in" className="font-semibold">
            Sign in
          </Link>
        )}
      </div>
    </header>
  );
}
