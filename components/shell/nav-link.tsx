"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";

export function NavLink({ href, activeUnder, children }: { href: string; activeUnder?: string[]; children: React.ReactNode }) {
  const pathname = usePathname();
  const under = activeUnder ?? (href === "/" ? [] : [href]);
  const active = pathname === href || under.some((prefix) => pathname.startsWith(`${prefix}/`));
  return (
    <Link
      href={href}
      aria-current={active ? "page" : undefined}
      className={`flex min-h-touch items-center border-b-4 px-3 font-semibold no-underline ${
        active ? "border-rust text-ink" : "border-transparent text-ink-soft hover:text-ink"
      }`}
    >
      {children}
    </Link>
  );
}
