import type { ReactNode } from "react";
import { Link } from "react-router";
import type { PublicVehicle } from "../../../../shared/schemas/public.ts";
import { formatConditionIndex } from "../../../../shared/domain/display.ts";
import { qrCodeUrl } from "../api/storefront.ts";
import { label, publishedText, odometerText, priceText, rangeText, shortUrl, yearText } from "../format.ts";
import { Qty } from "./Figure.tsx";

// Sizes are fractions of the card's width (cqw), so the screen preview and the printed A5 sheet are the same design;
// on a narrow screen a floor keeps the text readable and the card simply grows taller.
const t = {
  name: "text-[max(0.9375rem,2.3cqw)]",
  title: "text-[max(1.5rem,5.4cqw)]",
  variant: "text-[max(1.0625rem,2.5cqw)]",
  price: "text-[max(1.8rem,6.6cqw)]",
  figure: "text-[max(1.0625rem,2.6cqw)]",
  small: "text-[max(0.8125rem,1.75cqw)]",
  index: "text-[max(2.2rem,7.4cqw)]",
};

/**
 * The card for the car on the yard: A5 landscape (half an A4 sheet), read from a few steps away. Big title and
 * price, the figures a buyer compares, the condition index with its sentence, a few features, and the QR code to
 * the full report. The revision's cautions are on it word for word, as on the page and its print.
 */
export function WindowCard({ vehicle }: { vehicle: PublicVehicle }) {
  const s = vehicle.snapshot;
  const d = s.dealership;
  const locale = d.locale || "en";
  const price = priceText(s.priceCents, s.currency, locale);
  const range = rangeText(s.derived.rangeKm, d.distanceUnit, locale);
  const index = formatConditionIndex(s.condition.index, { locale });
  const features = s.features.slice(0, 4);
  const url = shortUrl(vehicle.url);
  const figures: Array<[string, ReactNode]> = [
    ["Odometer", <Qty text={odometerText(s.odometer.reading, s.odometer.unit, locale)} />],
    ["Year", yearText(s.buildYear) ?? "—"],
    ["Fuel and gearbox", [label("fuelType", s.fuelType), label("transmission", s.transmission)].filter(Boolean).join(" · ") || "—"],
    ["Range per tank, theoretical", <Qty text={range} />],
  ];
  if (s.fuelType === "electric") figures[3][0] = "Range per charge, theoretical";

  return (
    <div className="fr-card-page min-h-dvh bg-paper-sunk print:bg-white">
      <div className="mx-auto flex max-w-5xl flex-wrap items-center justify-between gap-3 px-4 py-4 print:hidden">
        <Link to={`/vehicles/${encodeURIComponent(vehicle.slug)}`} className="inline-flex min-h-11 items-center font-bold no-underline hover:underline">
          ← The full condition report
        </Link>
        <div className="flex flex-wrap items-center gap-3">
          <p className="text-sm text-ink">Prints on A5 landscape, or on A4 at “fit to page”.</p>
          <button
            type="button"
            onClick={() => window.print()}
            className="inline-flex min-h-11 items-center rounded-md border border-signal-strong bg-signal px-5 font-bold text-paper-raised hover:bg-signal-strong"
          >
            Print card
          </button>
        </div>
      </div>
      <main id="main" className="fr-card-wrap @container mx-auto max-w-5xl px-4 pb-10 print:p-0">
        <article
          aria-labelledby="card-title"
          className="fr-card-sheet flex flex-col gap-[max(0.75rem,2cqw)] rounded-sm border border-line-strong bg-white p-[max(1rem,3.6cqw)] text-ink shadow-sm md:aspect-[210/148]"
        >
          <header className={`flex flex-wrap items-baseline justify-between gap-x-4 border-b-2 border-ink pb-[1cqw] ${t.name}`}>
            <strong>{d.name}</strong>
            {d.phone ? <span className="font-bold figures">{d.phone}</span> : null}
          </header>

          <div className="grid flex-1 grid-cols-1 gap-[max(1rem,3cqw)] md:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
            <div className="flex min-w-0 flex-col gap-[max(0.75rem,1.6cqw)]">
              <div>
                <h1 id="card-title" className={`font-bold leading-[1.05] ${t.title}`}>
                  {s.title}
                </h1>
                {s.variant ? <p className={`mt-[0.4cqw] ${t.variant}`}>{s.variant}</p> : null}
              </div>
              <p className={`font-bold leading-none figures ${t.price}`}>
                {price ?? "Ask us for the price"}
                {vehicle.status !== "live" ? <span className={`ml-[1.5cqw] align-middle ${t.figure} uppercase`}>{vehicle.status === "reserved" ? "Reserved" : "Sold"}</span> : null}
              </p>
              <dl className="grid grid-cols-2 gap-x-[2cqw] gap-y-[1.2cqw]">
                {figures.map(([name, value]) => (
                  <div key={name} className="min-w-0">
                    <dt className={t.small}>{name}</dt>
                    <dd className={`font-bold figures ${t.figure}`}>{value}</dd>
                  </div>
                ))}
              </dl>
              {features.length ? (
                <ul className={`flex flex-wrap gap-x-[2cqw] gap-y-[0.6cqw] ${t.figure}`} aria-label="Key features">
                  {features.map((f) => (
                    <li key={f} className="before:mr-[0.8cqw] before:content-['✓']">
                      {f}
                    </li>
                  ))}
                </ul>
              ) : null}
            </div>

            <div className="flex min-w-0 flex-col gap-[max(0.75rem,1.6cqw)]">
              <div className="rounded-sm border-2 border-ink p-[1.6cqw]">
                <p className={`font-bold ${t.small}`}>Condition index</p>
                <p className="leading-none">
                  <span className={`font-bold figures ${t.index}`}>{index ?? "—"}</span>
                  {index !== null ? <span className={`unit ${t.figure}`}>/100</span> : null}
                </p>
                <p className={`mt-[0.6cqw] ${t.small}`}>{s.condition.sentence}</p>
              </div>
              {s.cautions.length ? (
                <section aria-labelledby="card-cautions" className="rounded-sm border-2 border-ink p-[1.6cqw]">
                  <h2 id="card-cautions" className={`font-bold ${t.small}`}>
                    Cautions
                  </h2>
                  <ul className={`mt-[0.4cqw] flex flex-col gap-[0.4cqw] ${t.small}`}>
                    {s.cautions.map((c) => (
                      <li key={c.code}>
                        <strong>{c.level === "block" ? "Safety: " : "Advisory: "}</strong>
                        {c.text}
                      </li>
                    ))}
                  </ul>
                </section>
              ) : null}
              <div className="flex items-center gap-[1.6cqw]">
                <img
                  src={qrCodeUrl(vehicle.slug)}
                  width={240}
                  height={240}
                  alt={`QR code to the full condition report at ${url}`}
                  className="size-[max(7rem,19cqw)] shrink-0 bg-white"
                />
                <p className={`min-w-0 ${t.small}`}>
                  <strong className="block">Scan for the full condition report</strong>
                  <span className="mt-[0.4cqw] block font-mono [overflow-wrap:anywhere]">
                    {url.split("/").map((part, i) => (
                      <span key={i}>
                        {i > 0 ? "/" : ""}
                        {i > 0 ? <wbr /> : null}
                        {part}
                      </span>
                    ))}
                  </span>
                </p>
              </div>
            </div>
          </div>

          <footer className={`border-t border-ink pt-[0.8cqw] ${t.small}`}>
            {d.name}
            {d.licenceNumber ? ` · Dealer licence ${d.licenceNumber}` : ""} · Stock number <span className="font-mono">{s.stockNumber}</span>
            <span className="block">
              From report revision {vehicle.revision.number} of {publishedText(vehicle.revision.publishedAt, d, "medium")}. Not a roadworthiness or safety certificate; have it inspected
              independently.
            </span>
          </footer>
        </article>
      </main>
    </div>
  );
}
