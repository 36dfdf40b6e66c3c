import type { ReactNode } from "react";
import { Link } from "react-router";
import type { PublicDealership } from "../../../../shared/schemas/dealership.ts";
import { addressLine, telHref } from "../format.ts";

/** The public pages' frame: the dealership's name, town and phone above; licence, address and staff sign-in below. */
export function SiteHeader({ dealership, children }: { dealership: PublicDealership | null; children?: ReactNode }) {
  return (
    <header className="border-b border-line bg-paper-raised print:hidden">
      <div className="mx-auto flex max-w-6xl flex-wrap items-center justify-between gap-x-6 gap-y-2 px-4 py-4 sm:px-6">
        <div className="min-w-0">
          <Link to="/" className="text-xl font-bold text-ink no-underline hover:text-signal-strong">
            {dealership?.name ?? "Vehicles for sale"}
          </Link>
          {dealership?.town ? <p className="text-sm text-ink-soft">{[dealership.town, dealership.region].filter(Boolean).join(", ")}</p> : null}
        </div>
        <div className="flex flex-wrap items-center gap-x-5 gap-y-1">
          {children}
          {dealership?.phone ? (
            <a href={telHref(dealership.phone)} className="inline-flex min-h-11 items-center font-bold no-underline hover:underline">
              <span className="sr-only">Call us on </span>
              {dealership.phone}
            </a>
          ) : null}
        </div>
      </div>
    </header>
  );
}

export function SiteFooter({ dealership }: { dealership: PublicDealership | null }) {
  return (
    <footer className="mt-16 border-t border-line bg-paper-raised print:hidden">
      <div className="mx-auto grid max-w-6xl grid-cols-1 gap-4 px-4 py-8 text-sm sm:grid-cols-[1fr_auto] sm:px-6">
        {dealership ? (
          <address className="not-italic text-ink">
            <strong>{dealership.name}</strong>
            <br />
            {addressLine(dealership)}
            {dealership.licenceNumber ? (
              <>
                <br />
                Dealer licence number <span className="font-mono">{dealership.licenceNumber}</span>
              </>
            ) : null}
            {dealership.phone || dealership.email ? (
              <>
                <br />
                {dealership.phone ? <a href={telHref(dealership.phone)}>{dealership.phone}</a> : null}
                {dealership.phone && dealership.email ? " · " : null}
                {dealership.email ? <a href={`mailto:${dealership.email}`}>{dealership.email}</a> : null}
              </>
            ) : null}
          </address>
        ) : (
          <span />
        )}
        <p className="sm:text-right">
          {/* A full page load: the staff area is its own application. */}
          <a href="/sign-in" className="inline-flex min-h-11 items-center no-underline hover:underline">
            Staff sign-in
          </a>
        </p>
      </div>
    </footer>
  );
}

/** A plain status word, never a colour alone. */
export function StatusWord({ status, className = "" }: { status: "live" | "reserved" | "sold"; className?: string }) {
  if (status === "live") return null;
  return (
    <span className={`inline-block rounded-sm border-2 border-ink bg-paper-raised px-2 py-0.5 text-sm font-bold uppercase tracking-wide text-ink ${className}`}>
      {status === "reserved" ? "Reserved" : "Sold"}
    </span>
  );
}
