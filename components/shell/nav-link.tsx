"use client";

import Link, { useLinkStatus } from "next/link";
import { usePathname } from "next/navigation";

/**
 * The groups have no loading.tsx (a Suspense fallback would send 200 before a
 * page can refuse with 403/404), so the link itself shows that it is on its way.
 */
function PendingHint() {
  const { pending } = useLinkStatus();
  return <span aria-hidden className={`ml-1 inline-block h-2 w-2 rounded-full bg-rust transition-opacity ${pending ? "animate-pulse opacity-100" : "opacity-0"}`} />;
}

export function NavLink({ href, children, exact = false }: { href: string; children: React.ReactNode; exact?: boolean }) {
  const pathname = usePathname();
  const active = pathname === href || (!exact && href !== "/" && pathname.startsWith(`${href}/`));
  return (
    <Link
      href={href}
      aria-current={active ? "page" : undefined}
      className={`flex min-h-touch shrink-0 items-center border-b-4 px-3 font-semibold whitespace-nowrap no-underline ${
        active ? "border-rust text-ink" : "border-transparent text-ink-soft hover:text-ink"
      }`}
    >
      {children}
      <PendingHint />
    </Link>
  );
}
