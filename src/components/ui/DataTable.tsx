import type { ReactNode } from "react";

/** A column of a staff table; `end` aligns figures to the right, `hidden` names it for assistive technology only. */
export interface Column {
  label: string;
  end?: boolean;
  hidden?: boolean;
}

/** The padding of every cell of a staff table. */
export const cell = "px-4 py-3";

/** The header row of a staff table: small capitals under a rule; `sunk` shades it, as in a framed table. */
export function TableHead({ columns, sunk = true }: { columns: readonly Column[]; sunk?: boolean }) {
  return (
    <thead className={`border-b border-line ${sunk ? "bg-paper-sunk " : ""}text-xs uppercase tracking-wide text-ink-soft`}>
      <tr>
        {columns.map((c) => (
          <th key={c.label} scope="col" className={c.end ? `${cell} text-right` : cell}>
            {c.hidden ? <span className="sr-only">{c.label}</span> : c.label}
          </th>
        ))}
      </tr>
    </thead>
  );
}

/**
 * A staff list as a table: framed, scrolling sideways on a narrow screen, its caption read to assistive technology.
 * The frame takes focus, so a keyboard can scroll a table that has nothing focusable in it (WCAG 2.1.1).
 */
export function DataTable({ caption, columns, children }: { caption: string; columns: readonly Column[]; children: ReactNode }) {
  return (
    <div role="region" aria-label={caption} tabIndex={0} className="overflow-x-auto rounded-lg border border-line bg-paper-raised">
      <table className="w-full text-left text-sm">
        <caption className="sr-only">{caption}</caption>
        <TableHead columns={columns} />
        <tbody>{children}</tbody>
      </table>
    </div>
  );
}
