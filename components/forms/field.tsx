import type { ComponentProps } from "react";

export const inputClass =
  "min-h-touch w-full rounded-card border-2 border-rule-strong bg-white px-3 text-base focus:border-ink aria-[invalid=true]:border-rust";

/** A labelled input with its error beside it; the error is announced and tied to the input. */
export function Field({
  label,
  name,
  error,
  hint,
  className = "",
  ...props
}: ComponentProps<"input"> & { label: string; name: string; error?: string; hint?: string }) {
  const errorId = `${name}-error`;
  return (
    <label className={`flex flex-col gap-1 ${className}`}>
      <span className="font-semibold">{label}</span>
      <input
        name={name}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? errorId : undefined}
        className={inputClass}
        {...props}
      />
      {hint && !error ? <span className="text-sm text-ink-faint">{hint}</span> : null}
      {error ? (
        <span id={errorId} className="text-sm font-semibold text-rust-deep">
          {error}
        </span>
      ) : null}
    </label>
  );
}

export function FormMessage({ result }: { result: { ok: boolean; error?: string } | null }) {
  if (!result || result.ok) return null;
  return (
    <p role="alert" className="rounded-card border-2 border-rust bg-rust-wash px-3 py-2 text-sm font-semibold text-rust-deep">
      {result.error}
    </p>
  );
}

/** A labelled select with its error beside it, like Field. Options are [value, label] pairs. */
export function SelectField({
  label,
  name,
  options,
  error,
  className = "",
  ...props
}: ComponentProps<"select"> & { label: string; name?: string; options: readonly (readonly [string, string])[]; error?: string }) {
  const errorId = `${name ?? label}-error`;
  return (
    <label className={`flex flex-col gap-1 ${className}`}>
      <span className="font-semibold">{label}</span>
      <select name={name} aria-invalid={error ? true : undefined} aria-describedby={error ? errorId : undefined} className={inputClass} {...props}>
        {options.map(([value, text]) => (
          <option key={value} value={value}>
            {text}
          </option>
        ))}
      </select>
      {error ? (
        <span id={errorId} className="text-sm font-semibold text-rust-deep">
          {error}
        </span>
      ) : null}
    </label>
  );
}
