import type { ReactNode } from "react";

/** A titled part of the condition page: a region with its own h2, in reading order. */
export function Section({ id, title, lead, children, className = "" }: { id: string; title: ReactNode; lead?: ReactNode; children: ReactNode; className?: string }) {
  return (
    <section id={id} aria-labelledby={`${id}-heading`} className={`fr-section scroll-mt-4 border-t border-line pt-8 ${className}`}>
      <h2 id={`${id}-heading`} className="text-2xl font-bold">
        {title}
      </h2>
      {lead ? <div className="mt-2 max-w-prose text-ink">{lead}</div> : null}
      <div className="mt-5">{children}</div>
    </section>
  );
}

/** A label over a figure, the way the staff sheets show them. */
export function Fact({ name, children, wide = false }: { name: ReactNode; children: ReactNode; wide?: boolean }) {
  return (
    <div className={`fr-fact min-w-0 ${wide ? "sm:col-span-2" : ""}`}>
      <dt className="text-sm text-ink-soft">{name}</dt>
      <dd className="font-bold figures">{children}</dd>
    </div>
  );
}
