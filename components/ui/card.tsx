import type { ComponentProps } from "react";

export function Card({ className = "", ...props }: ComponentProps<"section">) {
  return <section className={`rounded-card border border-rule bg-paper-card p-4 shadow-[0_1px_0_#d8cdb9] ${className}`} {...props} />;
}

export function CardTitle({ className = "", ...props }: ComponentProps<"h2">) {
  return <h2 className={`mb-2 text-lg font-bold ${className}`} {...props} />;
}
