import type { ReactNode } from "react";

type Tone = "info" | "success" | "caution" | "danger";

const tones: Record<Tone, { box: string; label: string }> = {
  info: { box: "border-line-strong bg-paper-raised", label: "Note" },
  success: { box: "border-signal bg-signal-wash", label: "Done" },
  caution: { box: "border-ochre bg-ochre-wash", label: "Caution" },
  danger: { box: "border-brick bg-brick-wash", label: "Problem" },
};

/** A message panel. The tone is spelt out in words as well as colour. */
export function Notice({ tone = "info", title, children, role }: { tone?: Tone; title?: ReactNode; children?: ReactNode; role?: "alert" | "status" }) {
  const t = tones[tone];
  return (
    <div role={role ?? (tone === "danger" ? "alert" : "status")} className={`rounded-md border-l-4 border px-4 py-3 ${t.box}`}>
      <p className="text-sm font-bold">
        <span className="sr-only">{t.label}: </span>
        {title ?? t.label}
      </p>
      {children ? <div className="mt-1 text-sm text-ink">{children}</div> : null}
    </div>
  );
}

export function Loading({ label = "Loading…" }: { label?: string }) {
  return (
    <div role="status" className="flex items-center gap-3 py-8 text-ink-soft">
      <span aria-hidden className="size-5 animate-spin rounded-full border-2 border-signal border-r-transparent" />
      {label}
    </div>
  );
}

export function EmptyState({ title, children }: { title: ReactNode; children?: ReactNode }) {
  return (
    <div className="rounded-lg border border-dashed border-line-strong bg-paper-raised px-6 py-10 text-center">
      <p className="text-lg font-bold">{title}</p>
      {children ? <div className="mx-auto mt-2 max-w-prose text-ink-soft">{children}</div> : null}
    </div>
  );
}
