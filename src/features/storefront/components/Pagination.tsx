import { Link } from "react-router";
import { formatNumber } from "../../../../shared/domain/display.ts";

/** Pages as links (each one a URL of its own): previous, a window of numbers around the current page, next. */
export function Pagination({ page, pageCount, href, locale }: { page: number; pageCount: number; href: (page: number) => string; locale: string }) {
  if (pageCount <= 1) return null;
  const shown = new Set([1, pageCount, page - 1, page, page + 1].filter((p) => p >= 1 && p <= pageCount));
  const pages = [...shown].sort((a, b) => a - b);
  const top = () => window.scrollTo({ top: 0 });
  const box = "inline-flex min-h-11 min-w-11 items-center justify-center rounded-md border px-3 font-bold no-underline";
  return (
    <nav aria-label="Pages of results" className="mt-8 flex flex-wrap items-center justify-center gap-2">
      {page > 1 ? (
        <Link to={href(page - 1)} onClick={top} className={`${box} border-line-strong bg-paper-raised`} rel="prev">
          ← Previous
        </Link>
      ) : null}
      <ul className="flex flex-wrap items-center gap-2">
        {pages.map((p, i) => (
          <li key={p} className="flex items-center gap-2">
            {i > 0 && p - pages[i - 1] > 1 ? <span aria-hidden className="text-ink-soft">…</span> : null}
            {p === page ? (
              <span aria-current="page" className={`${box} border-ink bg-ink text-paper-raised figures`}>
                <span className="sr-only">Page </span>
                {formatNumber(p, { locale })}
              </span>
            ) : (
              <Link to={href(p)} onClick={top} className={`${box} border-line-strong bg-paper-raised figures`}>
                <span className="sr-only">Page </span>
                {formatNumber(p, { locale })}
              </Link>
            )}
          </li>
        ))}
      </ul>
      {page < pageCount ? (
        <Link to={href(page + 1)} onClick={top} className={`${box} border-line-strong bg-paper-raised`} rel="next">
          Next →
        </Link>
      ) : null}
    </nav>
  );
}
