import type { ButtonHTMLAttributes } from "react";

type Tone = "primary" | "secondary" | "quiet" | "danger";

const tones: Record<Tone, string> = {
  primary: "bg-signal text-paper-raised hover:bg-signal-strong border border-signal-strong",
  secondary: "bg-paper-raised text-ink border border-line-strong hover:border-ink-soft",
  quiet: "bg-transparent text-signal border border-transparent hover:bg-signal-wash",
  danger: "bg-paper-raised text-brick border border-brick hover:bg-brick-wash",
};

export function Button({
  tone = "primary",
  busy = false,
  className = "",
  children,
  disabled,
  ...rest
}: ButtonHTMLAttributes<HTMLButtonElement> & { tone?: Tone; busy?: boolean }) {
  return (
    <button
      {...rest}
      disabled={disabled || busy}
      aria-busy={busy || undefined}
      className={`inline-flex min-h-11 items-center justify-center gap-2 rounded-md px-4 py-2 text-base font-bold transition-colors disabled:cursor-not-allowed disabled:opacity-60 ${tones[tone]} ${className}`}
    >
      {busy ? <span aria-hidden className="size-4 animate-spin rounded-full border-2 border-current border-r-transparent" /> : null}
      {children}
    </button>
  );
}
