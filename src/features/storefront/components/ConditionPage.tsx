import { useEffect } from "react";
import { Link } from "react-router";
import type { PublicVehicle } from "../../../../shared/schemas/public.ts";
import { addressLine, publishedText, shortUrl } from "../format.ts";
import { SiteFooter, SiteHeader } from "./SiteChrome.tsx";
import { AboutReport } from "./condition/AboutReport.tsx";
import { Cautions } from "./condition/Cautions.tsx";
import { Gallery } from "./condition/Gallery.tsx";
import { KeySummary } from "./condition/KeySummary.tsx";
import { Dealership, Enquiry, ReportActions } from "./condition/NextSteps.tsx";
import { Revisions } from "./condition/Revisions.tsx";
import { Section } from "./condition/Section.tsx";
import { ServiceHistory } from "./condition/ServiceHistory.tsx";
import { Specifications } from "./condition/Specifications.tsx";
import { TyresAndChecks } from "./condition/TyresAndChecks.tsx";
import { WhatWeFound } from "./condition/WhatWeFound.tsx";
import { loadEveryImage } from "./printing.ts";

/**
 * The condition page of one published revision, in the order a buyer asks: what is it and what does it cost, what
 * does it look like, what is wrong with it, how has it been kept, what do I do next.
 */
export function ConditionPage({ vehicle, latest }: { vehicle: PublicVehicle; latest: number }) {
  const s = vehicle.snapshot;
  const locale = s.dealership.locale || "en";
  const older = vehicle.revision.number < latest;
  const published = publishedText(vehicle.revision.publishedAt, s.dealership);
  const current = `/vehicles/${encodeURIComponent(vehicle.slug)}`;
  // Printing from the browser's own menu: ask for every photo at once (the button also waits for them).
  useEffect(() => {
    window.addEventListener("beforeprint", loadEveryImage);
    return () => window.removeEventListener("beforeprint", loadEveryImage);
  }, []);
  return (
    <div className="fr-report flex min-h-dvh flex-col">
      <PrintPage url={vehicle.url} revision={vehicle.revision.number} published={published} />
      <SiteHeader dealership={s.dealership}>
        <Link to="/" className="inline-flex min-h-11 items-center no-underline hover:underline">
          All vehicles
        </Link>
      </SiteHeader>
      {older ? (
        <div role="note" className="fr-old-revision border-b-2 border-ochre bg-ochre-wash">
          <p className="mx-auto max-w-6xl px-4 py-3 sm:px-6">
            <strong>
              You are viewing revision {vehicle.revision.number} published on {published}
            </strong>
            , an earlier version of this report kept as it was. <Link to={current} className="font-bold">See the current report</Link>.
          </p>
        </div>
      ) : null}
      <main id="main" className="mx-auto w-full max-w-6xl flex-1 px-4 py-6 sm:px-6 sm:py-8">
        <article aria-labelledby="vehicle-title" className="flex flex-col gap-10">
          {/* On paper the dealership's details head the report (the "Who is selling it" section is left off there). */}
          <p className="fr-print-head hidden print:block">
            <strong>Condition report · {s.dealership.name}</strong>, {addressLine(s.dealership)}
            {s.dealership.phone ? ` · ${s.dealership.phone}` : ""}
            {s.dealership.email ? ` · ${s.dealership.email}` : ""}
            {s.dealership.licenceNumber ? ` · Dealer licence ${s.dealership.licenceNumber}` : ""}
          </p>
          <div className="fr-top grid grid-cols-1 gap-6 lg:grid-cols-[minmax(0,5fr)_minmax(0,7fr)] lg:items-start lg:gap-10">
            <KeySummary vehicle={vehicle} locale={locale} />
            <Gallery photos={s.photos} title={s.title} locale={locale} />
          </div>
          <WhatWeFound snapshot={s} locale={locale} />
          <TyresAndChecks snapshot={s} locale={locale} />
          <Cautions cautions={s.cautions} />
          <Specifications snapshot={s} locale={locale} />
          {/* Two columns where it helps on a wide screen; one after the other, in this order, on a phone and on paper. */}
          <div className="fr-pair grid grid-cols-1 gap-10 lg:grid-cols-2">
            <ServiceHistory snapshot={s} locale={locale} />
            {s.descriptionHtml.trim() ? (
              <Section id="listing" title="About this vehicle" className="fr-listing">
                <div className="prose-copy max-w-prose" dangerouslySetInnerHTML={{ __html: s.descriptionHtml }} />
              </Section>
            ) : null}
          </div>
          <div className="fr-pair grid grid-cols-1 gap-10 lg:grid-cols-2">
            <Revisions
              slug={vehicle.slug}
              revisions={vehicle.revisions.length ? vehicle.revisions : [vehicle.revision]}
              viewing={vehicle.revision.number}
              latest={latest}
              dealership={s.dealership}
            />
            <Dealership snapshot={s} />
          </div>
          <div className="fr-pair grid grid-cols-1 gap-10 lg:grid-cols-2">
            <AboutReport snapshot={s} revision={vehicle.revision.number} publishedAt={vehicle.revision.publishedAt} locale={locale} />
            <Enquiry snapshot={s} status={vehicle.status} revision={vehicle.revision.number} slug={vehicle.slug} />
          </div>
          <div className="border-t border-line pt-6 print:hidden">
            <ReportActions slug={vehicle.slug} enquiryLink={false} />
          </div>
          <p className="fr-print-footer hidden text-sm print:block">
            {shortUrl(vehicle.url)} · Revision {vehicle.revision.number}, published {published}
          </p>
        </article>
      </main>
      <SiteFooter dealership={s.dealership} />
    </div>
  );
}

/** A CSS string, escaped (the text comes from the server, into a stylesheet). */
const cssString = (text: string) => `"${text.replace(/\\/g, "\\\\").replace(/"/g, '\\"').replace(/[\r\n]+/g, " ")}"`;

/** The printed page's footer: the page's address, the revision and its date on every sheet, and the page count. */
function PrintPage({ url, revision, published }: { url: string; revision: number; published: string }) {
  const left = cssString(`${shortUrl(url)} · revision ${revision}, published ${published}`);
  // A constructed stylesheet rather than a <style> element, so the CSP needs no 'unsafe-inline' for styles.
  useEffect(() => {
    // Constructed stylesheets arrived in Safari 16.4; older browsers print without the footer rather than fail.
    if (typeof CSSStyleSheet === "undefined" || !("adoptedStyleSheets" in document) || !("replaceSync" in CSSStyleSheet.prototype)) return;
    const sheet = new CSSStyleSheet();
    sheet.replaceSync(`@page report { @bottom-left { content: ${left}; } @bottom-right { content: "Page " counter(page) " of " counter(pages); } }`);
    document.adoptedStyleSheets = [...document.adoptedStyleSheets, sheet];
    return () => {
      document.adoptedStyleSheets = document.adoptedStyleSheets.filter((s) => s !== sheet);
    };
  }, [left]);
  return null;
}
