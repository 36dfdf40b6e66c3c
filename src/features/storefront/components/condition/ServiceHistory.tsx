import type { PublicSnapshot } from "../../../../../shared/schemas/public.ts";
import { formatDistance } from "../../../../../shared/domain/display.ts";
import { dateText, label } from "../../format.ts";
import { Qty } from "../Figure.tsx";
import { Section } from "./Section.tsx";

/** The service history as a timeline, oldest first; a reading lower than an earlier one is said in words. */
export function ServiceHistory({ snapshot: s, locale }: { snapshot: PublicSnapshot; locale: string }) {
  const unit = s.dealership.distanceUnit;
  const km = (v: number) => formatDistance(v, unit, { locale });
  const flags = s.derived.odometerFlags;
  const entries = s.serviceHistory
    .map((e, index) => ({ ...e, index }))
    .sort((a, b) => (a.date === b.date ? a.odometerKm - b.odometerKm : a.date < b.date ? -1 : 1));
  const lower = (e: (typeof entries)[number]) => flags.find((f) => f.laterIndex === e.index || (f.laterDate === e.date && f.laterKm === e.odometerKm));
  const next = s.derived.nextService;

  return (
    <Section id="service" title="How it has been kept" lead={<p className="print:hidden">The service records that came with the vehicle, as written in its books and invoices.</p>}>
      {flags.length ? (
        <div role="note" className="mb-5 rounded-lg border-2 border-brick bg-brick-wash px-4 py-3">
          <p className="font-bold text-brick">The odometer reading went down between two services</p>
          <ul className="mt-1 flex flex-col gap-1">
            {flags.map((f, i) => (
              <li key={i}>
                <Qty text={km(f.earlierKm)} /> on {dateText(f.earlierDate, locale)}, then <Qty text={km(f.laterKm)} /> on {dateText(f.laterDate, locale)}.
              </li>
            ))}
          </ul>
          <p className="mt-2">
            A lower later reading can come from a replaced instrument, a mistake in the records, or tampering. Ask us what we know, and have
            the history checked before you buy.
          </p>
        </div>
      ) : null}

      {entries.length === 0 ? (
        <p className="rounded-md border-l-4 border-ochre bg-ochre-wash px-3 py-2">No service records came with this vehicle. Ask us what we know of its history.</p>
      ) : (
        <ol className="fr-timeline relative ml-2 flex flex-col gap-5 border-l-2 border-line-strong pl-6">
          {entries.map((e) => {
            const flag = lower(e);
            return (
              <li key={e.index} className="fr-timeline-entry relative">
                <span aria-hidden className="absolute -left-[33px] top-1.5 size-4 rounded-full border-2 border-ink bg-paper-raised" />
                <p className="flex flex-wrap items-baseline gap-x-3">
                  <time dateTime={e.date} className="font-bold">
                    {dateText(e.date, locale)}
                  </time>
                  <span>
                    <Qty text={km(e.odometerKm)} />
                  </span>
                </p>
                <p>
                  {label("serviceKind", e.kind) ?? "Service"}
                  {e.workshop ? <> · {e.workshop}</> : null}
                </p>
                {e.notes ? <p className="text-sm">{e.notes}</p> : null}
                {flag ? (
                  <p className="mt-1 font-bold text-brick">
                    Lower than the <Qty text={km(flag.earlierKm)} /> recorded on {dateText(flag.earlierDate, locale)}.
                  </p>
                ) : null}
              </li>
            );
          })}
        </ol>
      )}

      {next && (next.dueByDate || next.dueByKm !== null) ? (
        <p className={`mt-5 ${next.overdue ? "rounded-md border-l-4 border-ochre bg-ochre-wash px-3 py-2" : ""}`}>
          <strong>{next.overdue ? "Service overdue: " : "Next service due "}</strong>
          {next.overdue ? "it was due " : ""}
          {[next.dueByDate ? `by ${dateText(next.dueByDate, locale)}` : null, next.dueByKm !== null ? `at ${km(next.dueByKm)}` : null].filter(Boolean).join(" or ")}
          {next.overdue ? ", whichever came first. Ask us whether it will be done before sale." : ", whichever comes first."}
        </p>
      ) : null}
    </Section>
  );
}
