import type { ReactNode } from "react";
import { Link } from "react-router";
import type { PublicDealership } from "../../../../shared/schemas/dealership.ts";
import { telHref } from "../format.ts";
import { SiteFooter, SiteHeader } from "./SiteChrome.tsx";

const stockLink =
  "inline-flex min-h-11 items-center rounded-md border border-signal-strong bg-signal px-4 font-bold text-paper-raised no-underline hover:bg-signal-strong hover:text-paper-raised";

function Frame({ dealership, title, children }: { dealership: PublicDealership | null; title: string; children: ReactNode }) {
  return (
    <div className="flex min-h-dvh flex-col">
      <SiteHeader dealership={dealership} />
      <main id="main" className="mx-auto w-full max-w-3xl flex-1 px-4 py-12 sm:px-6">
        <h1 className="text-3xl font-bold">{title}</h1>
        <div className="mt-4 flex max-w-prose flex-col gap-4 text-lg">{children}</div>
      </main>
      <SiteFooter dealership={dealership} />
    </div>
  );
}

/** 410: the vehicle was taken off the site. Polite, and straight to what is for sale now. */
export function Withdrawn({ dealership }: { dealership: PublicDealership | null }) {
  return (
    <Frame dealership={dealership} title="This vehicle is no longer advertised">
      <p>It may have been sold, or taken off sale for now. Its condition report is no longer shown.</p>
      <p>
        <Link to="/" className={stockLink}>
          See the vehicles we have now
        </Link>
      </p>
      {dealership?.phone ? (
        <p>
          Questions about it? Call us on{" "}
          <a href={telHref(dealership.phone)} className="whitespace-nowrap">
            {dealership.phone}
          </a>
          .
        </p>
      ) : null}
    </Frame>
  );
}

/** 404: never published (or a mistyped address). */
export function NotFound({ dealership, what = "vehicle" }: { dealership: PublicDealership | null; what?: "vehicle" | "revision" }) {
  return (
    <Frame dealership={dealership} title={what === "revision" ? "We could not find that revision" : "We could not find this vehicle"}>
      <p>{what === "revision" ? "This report has no revision with that number." : "The address may be mistyped, or the vehicle was never listed here."}</p>
      <p>
        <Link to="/" className={stockLink}>
          See the vehicles for sale
        </Link>
      </p>
    </Frame>
  );
}

export function LoadFailed({ dealership, message, onRetry }: { dealership: PublicDealership | null; message: string; onRetry: () => void }) {
  return (
    <Frame dealership={dealership} title="This page could not load">
      <p>{message}</p>
      <p>
        <button type="button" onClick={onRetry} className={stockLink}>
          Try again
        </button>
      </p>
    </Frame>
  );
}

export function PageLoading({ label }: { label: string }) {
  return (
    <div className="mx-auto flex min-h-dvh max-w-6xl items-start px-4 py-12 sm:px-6">
      <p role="status" className="flex items-center gap-3 text-ink-soft">
        <span aria-hidden className="size-5 animate-spin rounded-full border-2 border-signal border-r-transparent" />
        {label}
      </p>
    </div>
  );
}
