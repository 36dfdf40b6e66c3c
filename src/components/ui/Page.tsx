import { useId, type ReactNode } from "react";

export function PageHeader({ title, lead, actions }: { title: ReactNode; lead?: ReactNode; actions?: ReactNode }) {
  return (
    <header className="mb-6 flex flex-wrap items-end justify-between gap-4 border-b border-line pb-4">
      <div>
        <h1 className="text-2xl font-bold">{title}</h1>
        {lead ? <p className="mt-1 max-w-prose text-ink-soft">{lead}</p> : null}
      </div>
      {actions ? <div className="flex flex-wrap gap-2">{actions}</div> : null}
    </header>
  );
}

/** A titled block of a staff page; its heading names it, so assistive technology lists it as a region. */
export function Panel({ title, children, className = "" }: { title?: ReactNode; children: ReactNode; className?: string }) {
  const id = useId();
  return (
    <section className={`rounded-lg border border-line bg-paper-raised p-5 ${className}`} aria-labelledby={title ? id : undefined}>
      {title ? <h2 id={id} className="mb-3 text-lg font-bold">{title}</h2> : null}
      {children}
    </section>
  );
}

/** The product's mark: a plain wordmark with a checked-box glyph of our own. */
export function Wordmark({ className = "" }: { className?: string }) {
  return (
    <span className={`inline-flex items-center gap-2 font-bold tracking-tight ${className}`}>
      <svg aria-hidden viewBox="0 0 24 24" className="size-6" fill="none" stroke="currentColor" strokeWidth="2">
        <rect x="3" y="3" width="18" height="18" rx="2" />
        <path d="M7 12.5l3.2 3.2L17 9" />
      </svg>
      Forthright
    </span>
  );
}
