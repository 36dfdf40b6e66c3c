import { Link } from "react-router";
import type { PublicVehicleCard } from "../../../../shared/schemas/public.ts";
import { formatConditionIndex } from "../../../../shared/domain/display.ts";
import { count, label, odometerText, priceText, rangeText, yearText, zoneLabel } from "../format.ts";
import { Qty } from "./Figure.tsx";
import { Picture } from "../../../components/ui/Picture.tsx";
import { StatusWord } from "./SiteChrome.tsx";

/** One vehicle on the storefront. The whole card is the link; the figures line up in tabular digits. */
export function VehicleCard({ card, index, locale, distanceUnit }: { card: PublicVehicleCard; index: number; locale: string; distanceUnit: "km" | "mi" }) {
  const price = priceText(card.priceCents, card.currency, locale);
  const index100 = formatConditionIndex(card.conditionIndex, { locale });
  const facts: Array<[string, string | null]> = [
    ["Odometer", odometerText(card.odometer.reading, card.odometer.unit, locale)],
    ["Year", yearText(card.buildYear)],
    ["Fuel", label("fuelType", card.fuelType)],
    ["Gearbox", label("transmission", card.transmission)],
  ];
  const range = rangeText(card.rangeKm, distanceUnit, locale);
  return (
    <article className="relative flex flex-col overflow-hidden rounded-lg border border-line bg-paper-raised has-[a:focus-visible]:outline-3 has-[a:focus-visible]:outline-offset-2 has-[a:focus-visible]:outline-signal has-[a:hover]:border-line-strong">
      <div className="relative aspect-[4/3] bg-paper-sunk">
        {card.cover ? (
          <Picture
            photo={card.cover}
            alt={card.cover.caption.trim() || `${card.title}${card.cover.zone ? `, ${zoneLabel(card.cover.zone).toLowerCase()}` : ""}`}
            sizes="(min-width: 1024px) 360px, (min-width: 640px) 50vw, 100vw"
            eager={index < 2}
            highPriority={index === 0}
            fill="cover"
          />
        ) : (
          <p className="flex h-full items-center justify-center px-4 text-center text-ink-soft">Photos in the condition report</p>
        )}
        {card.status !== "live" ? (
          <span aria-hidden className="absolute left-3 top-3">
            <StatusWord status={card.status} />
          </span>
        ) : null}
      </div>
      <div className="flex flex-1 flex-col gap-3 p-4">
        <div>
          <h3 className="text-lg font-bold">
            <Link to={`/vehicles/${encodeURIComponent(card.slug)}`} className="text-ink no-underline outline-none after:absolute after:inset-0 hover:underline">
              {card.title}
            </Link>
          </h3>
          {card.variant ? <p className="text-ink-soft">{card.variant}</p> : null}
        </div>
        <p className="text-2xl font-bold figures">
          {price ?? <span className="text-lg">Ask us for the price</span>}
          {card.status !== "live" ? <span className="ml-2 align-middle text-base font-bold">· {card.status === "reserved" ? "Reserved" : "Sold"}</span> : null}
        </p>
        <dl className="grid grid-cols-2 gap-x-4 gap-y-2 text-sm">
          {facts.map(([name, value]) => (
            <div key={name}>
              <dt className="text-ink-soft">{name}</dt>
              <dd className="font-bold">
                <Qty text={value} />
              </dd>
            </div>
          ))}
          {range ? (
            <div className="col-span-2">
              <dt className="text-ink-soft">{card.fuelType === "electric" ? "Range per charge" : "Range per tank"}, theoretical</dt>
              <dd className="font-bold">
                <Qty text={range} />
              </dd>
            </div>
          ) : null}
        </dl>
        <p className="mt-auto border-t border-line pt-3 text-sm">
          {index100 !== null ? (
            <>
              Condition index <strong className="text-base figures">{index100}</strong>
              <span className="unit">/100</span> ·{" "}
            </>
          ) : null}
          {card.defectCount === 0 ? "No items noted" : `${count(card.defectCount, "item", "items", locale)} noted`}
        </p>
      </div>
    </article>
  );
}
