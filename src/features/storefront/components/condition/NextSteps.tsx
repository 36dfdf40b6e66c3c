import { Link } from "react-router";
import type { PublicSnapshot, PublicStatus } from "../../../../../shared/schemas/public.ts";
import { addressLine, telHref } from "../../format.ts";
import { printWithImages } from "../printing.ts";
import { Section } from "./Section.tsx";
import { EnquiryForm } from "../../../enquiries/EnquiryForm.tsx";

const button = "inline-flex min-h-11 items-center justify-center rounded-md border px-4 py-2 font-bold no-underline";

/** "Ask about this vehicle": the enquiry form (it becomes a lead for the salesperson), with phone and e-mail beside it. */
export function Enquiry({ snapshot: s, status, revision, slug }: { snapshot: PublicSnapshot; status: PublicStatus; revision: number; slug: string }) {
  const d = s.dealership;
  const subject = `Stock number ${s.stockNumber}: ${s.title}`;
  return (
    <Section id="enquiry" title="Ask about this vehicle" className="fr-enquiry print:hidden">
      <div className="rounded-lg border border-line bg-paper-raised p-5">
        <p className="max-w-prose">
          {status === "sold"
            ? "This vehicle is sold. Ask us about similar ones, or about this report."
            : status === "reserved"
              ? "This vehicle is reserved for another buyer. Ask us to tell you if it becomes available again."
              : "Ask us anything about this vehicle, arrange a viewing or a test drive, or book an independent inspection."}
        </p>
        {status !== "sold" ? (
          <div className="mt-4">
            <EnquiryForm
              slug={slug}
              revision={revision}
              vehicleTitle={s.title}
              stockNumber={s.stockNumber}
              dealership={{ name: d.name, phone: d.phone, email: d.email }}
            />
          </div>
        ) : null}
        <div className="mt-4 flex flex-wrap gap-3">
          {d.phone ? (
            <a href={telHref(d.phone)} className={`${button} border-line-strong bg-paper-raised text-ink hover:border-ink`}>
              Call {d.phone}
            </a>
          ) : null}
          {d.email ? (
            <a href={`mailto:${d.email}?subject=${encodeURIComponent(subject)}`} className={`${button} border-line-strong bg-paper-raised text-ink hover:border-ink`}>
              E-mail {d.email}
            </a>
          ) : null}
        </div>
        {!d.phone && !d.email ? <p className="mt-3">Visit us at {addressLine(d)}.</p> : null}
      </div>
    </Section>
  );
}

export function Dealership({ snapshot: s }: { snapshot: PublicSnapshot }) {
  const d = s.dealership;
  return (
    <Section id="dealership" title="Who is selling it">
      <address className="fr-dealership not-italic">
        <strong className="text-lg">{d.name}</strong>
        <br />
        {addressLine(d)}
        {d.licenceNumber ? (
          <>
            <br />
            Dealer licence number <span className="font-mono">{d.licenceNumber}</span>
          </>
        ) : null}
        {d.phone ? (
          <>
            <br />
            Phone <a href={telHref(d.phone)}>{d.phone}</a>
          </>
        ) : null}
        {d.email ? (
          <>
            <br />
            E-mail <a href={`mailto:${d.email}`}>{d.email}</a>
          </>
        ) : null}
        {d.website ? (
          <>
            <br />
            <a href={d.website}>{d.website.replace(/^https?:\/\//, "")}</a>
          </>
        ) : null}
      </address>
    </Section>
  );
}

/** Print this report and the window card. */
export function ReportActions({ slug, enquiryLink = true }: { slug: string; enquiryLink?: boolean }) {
  return (
    <div className="fr-actions flex flex-wrap gap-3 print:hidden">
      <button type="button" onClick={() => void printWithImages()} className={`${button} border-line-strong bg-paper-raised text-ink hover:border-ink`}>
        Print this report
      </button>
      <Link to={`/vehicles/${encodeURIComponent(slug)}/card`} className={`${button} border-line-strong bg-paper-raised text-ink hover:border-ink`}>
        Window card
      </Link>
      {enquiryLink ? (
        <a href="#enquiry" className={`${button} border-transparent px-2 text-signal hover:bg-signal-wash`}>
          Ask about this vehicle
        </a>
      ) : null}
    </div>
  );
}
