import type { PublicVehicle } from "../../../../../shared/schemas/public.ts";
import { formatConditionIndex } from "../../../../../shared/domain/display.ts";
import { count, dateText, label, odometerText, priceText, publishedText, rangeText, yearText } from "../../format.ts";
import { Qty } from "../Figure.tsx";
import { ReportActions } from "./NextSteps.tsx";
import { Fact } from "./Section.tsx";

/** What it is and what it costs: title, price, the status word, the key figures, and any safety caution at once. */
export function KeySummary({ vehicle, locale }: { vehicle: PublicVehicle; locale: string }) {
  const s = vehicle.snapshot;
  const price = priceText(s.priceCents, s.currency, locale);
  const index = formatConditionIndex(s.condition.index, { locale });
  const total = s.defects.length;
  const range = rangeText(s.derived.rangeKm, s.dealership.distanceUnit, locale);
  const blocks = s.cautions.filter((c) => c.level === "block");
  return (
    <div className="fr-summary flex min-w-0 flex-col gap-5">
      <div>
        <h1 id="vehicle-title" className="text-3xl font-bold sm:text-4xl">
          {s.title}
        </h1>
        {s.variant ? <p className="mt-1 text-lg text-ink-soft">{s.variant}</p> : null}
        <p className="mt-1 text-sm">
          Stock number <span className="font-mono">{s.stockNumber}</span>
        </p>
      </div>
      <div className="flex flex-wrap items-center gap-x-4 gap-y-2">
        <p className="text-4xl font-bold figures">{price ?? <span className="text-2xl">Ask us for the price</span>}</p>
        {vehicle.status !== "live" ? (
          <p className="rounded-sm border-2 border-ink px-2 py-0.5 text-lg font-bold uppercase tracking-wide">{vehicle.status === "reserved" ? "Reserved" : "Sold"}</p>
        ) : null}
      </div>
      {vehicle.status === "reserved" ? <p>Another buyer has reserved this vehicle. Ask us to tell you if it becomes available again.</p> : null}
      {vehicle.status === "sold" ? <p>This vehicle is sold. The report stays here as the record of what was shown.</p> : null}

      <dl className="fr-keyfigures grid grid-cols-2 gap-x-4 gap-y-4 rounded-lg border border-line bg-paper-raised p-4 sm:grid-cols-3">
        <Fact name="Odometer, as read">
          <Qty text={odometerText(s.odometer.reading, s.odometer.unit, locale)} />
        </Fact>
        <Fact name="Year">{yearText(s.buildYear) ?? "—"}</Fact>
        <Fact name="Fuel">{label("fuelType", s.fuelType) ?? "—"}</Fact>
        <Fact name="Gearbox">{label("transmission", s.transmission) ?? "—"}</Fact>
        {range ? (
          <Fact name={s.fuelType === "electric" ? "Range per charge" : "Range per tank"}>
            <Qty text={range} /> <span className="block text-sm font-normal">theoretical</span>
          </Fact>
        ) : null}
        <Fact name="Condition index">
          {index !== null ? (
            <>
              {index}
              <span className="unit">/100</span>
            </>
          ) : (
            "—"
          )}
          <span className="block text-sm font-normal">{total === 0 ? "no items noted" : `${count(total, "item", "items", locale)} noted`}</span>
        </Fact>
      </dl>

      {blocks.length ? (
        <p role="note" className="rounded-md border-2 border-brick bg-brick-wash px-4 py-3">
          <strong className="text-brick">Safety: </strong>
          {count(blocks.length, "item needs", "items need", locale)} putting right before the vehicle is used on the road. <a href="#cautions">Read the cautions</a>.
        </p>
      ) : null}

      {/* On paper the foot of every page says this. */}
      <p className="text-sm print:hidden">
        Report revision {vehicle.revision.number}, published {publishedText(vehicle.revision.publishedAt, s.dealership)}
        {s.inspectedOn ? `, from the inspection on ${dateText(s.inspectedOn, locale)}` : ""}.
      </p>
      <ReportActions slug={vehicle.slug} />
    </div>
  );
}
