import Link from "next/link";
import { ROLE_LABELS, type Role } from "@/lib/domain";
import { NavLink } from "./nav-link";
import { SignOutButton } from "./sign-out-button";

export interface NavItem {
  href: string;
  label: string;
}

/** The frame around every signed-in page: wordmark, where you can go, who you are. */
export function AppShell({
  home,
  orgName,
  nav,
  user,
  meHref,
  children,
}: {
  home: string;
  meHref: string;
  orgName: string;
  nav: NavItem[];
  user: { name: string; role: Role };
  children: React.ReactNode;
}) {
  return (
    <div className="flex min-h-dvh flex-col">
      <header className="no-print border-b border-rule bg-paper-card">
        <div className="mx-auto flex max-w-6xl flex-wrap items-center gap-x-4 px-3 sm:px-5">
          <Link href={home} className="flex min-h-touch items-center gap-2 py-2 no-underline">
            <CotterMark />
            <span className="text-xl font-bold tracking-tight">Cotter</span>
            <span className="hidden text-sm text-ink-faint sm:inline">· {orgName}</span>
          </Link>
          <nav aria-label="Main" className="order-last -mx-3 flex w-full overflow-x-auto sm:order-none sm:mx-0 sm:w-auto">
            {nav.map((item) => (
              <NavLink key={item.href} href={item.href} exact={nav.some((other) => other.href !== item.href && other.href.startsWith(`${item.href}/`))}>
                {item.label}
              </NavLink>
            ))}
          </nav>
          <div className="ml-auto flex items-center gap-2 text-sm">
            {/* The name is read from the visible text (with a spoken lead-in), so what people see is what a voice user says. */}
            <Link href={meHref} className="flex min-h-touch flex-col justify-center px-1 text-right leading-tight no-underline">
              <span className="sr-only">Your sign-in: </span>
              <span className="hidden font-semibold sm:block">{user.name}</span>
              <span className="hidden text-ink-faint sm:block">{ROLE_LABELS[user.role]}</span>
              <span className="font-semibold sm:hidden">
                You<span className="sr-only">, {user.name}</span>
              </span>
            </Link>
            <SignOutButton />
          </div>
        </div>
      </header>
      <main className="mx-auto w-full max-w-6xl flex-1 px-3 py-5 sm:px-5">{children}</main>
    </div>
  );
}

/** A cotter pin seen end-on: a loop and two legs, one bent back. */
export function CotterMark({ size = 28 }: { size?: number }) {
  return (
    <svg width={size} height={size} viewBox="0 0 32 32" aria-hidden>
      <circle cx="16" cy="8" r="5.5" fill="none" stroke="#b4501e" strokeWidth="3" />
      <path d="M13.5 13 V28" stroke="#2a2a28" strokeWidth="3" strokeLinecap="round" />
      <path d="M18.5 13 V22 L24 27" stroke="#2a2a28" strokeWidth="3" strokeLinecap="round" fill="none" />
    </svg>
  );
}
