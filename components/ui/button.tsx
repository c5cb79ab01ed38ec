import Link from "next/link";
import type { ComponentProps } from "react";

type Variant = "primary" | "secondary" | "quiet" | "danger";

const base =
  "inline-flex min-h-touch items-center justify-center gap-2 rounded-card px-4 py-2 text-[0.95rem] font-semibold transition-colors disabled:cursor-not-allowed disabled:opacity-50";

const variants: Record<Variant, string> = {
  primary: "bg-rust text-white hover:bg-rust-deep",
  secondary: "border-2 border-ink bg-paper-card text-ink hover:bg-paper-deep",
  quiet: "text-ink underline decoration-rule-strong underline-offset-4 hover:decoration-ink",
  danger: "border-2 border-rust-deep bg-paper-card text-rust-deep hover:bg-rust-wash",
};

export function buttonClass(variant: Variant = "primary", extra = ""): string {
  return `${base} ${variants[variant]} ${extra}`;
}

export function Button({ variant = "primary", className = "", ...props }: ComponentProps<"button"> & { variant?: Variant }) {
  return <button className={buttonClass(variant, className)} {...props} />;
}

export function ButtonLink({
  variant = "primary",
  className = "",
  ...props
}: ComponentProps<typeof Link> & { variant?: Variant }) {
  return <Link className={buttonClass(variant, `no-underline ${className}`)} {...props} />;
}
