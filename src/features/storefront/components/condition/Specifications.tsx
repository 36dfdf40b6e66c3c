import type { ReactNode } from "react";
import type { PublicSnapshot } from "../../../../../shared/schemas/public.ts";
import {
  formatCo2,
  formatConsumption,
  formatDistance,
  formatMass,
  formatNumber,
  formatPower,
  formatPowerToWeight,
  formatTorque,
  withUnit,
  type ConsumptionUnit,
} from "../../../../../shared/domain/display.ts";
import { specLabel } from "../../../../../shared/constants/vehicle-fields.ts";
import { dateText, label, odometerText, rangeText, yearText } from "../../format.ts";
import { Qty } from "../Figure.tsx";
import { Fact, Section } from "./Section.tsx";

type Row = [name: string, value: ReactNode | null];

/** Figures joined with a middle dot, each kept whole. */
function Several({ texts }: { texts: Array<string | null> }) {
  const shown = texts.filter((t): t is string => !!t);
  if (!shown.length) return null;
  return (
    <>
      {shown.map((t, i) => (
        <span key={i}>
          {i > 0 ? " · " : ""}
          <Qty text={t} />
        </span>
      ))}
    </>
  );
}

const oneDecimalIfNeeded = (v: number | null) => (v !== null && !Number.isInteger(v) ? 1 : 0);

/** The specification with the server's derived figures, in the units of the dealership's market. */
export function Specifications({ snapshot: s, locale }: { snapshot: PublicSnapshot; locale: string }) {
  const d = s.derived;
  const o = { locale };
  const unit = s.dealership.distanceUnit;
  const cycle = label("consumptionTestCycle", d.consumptionTestCycle ?? s.consumptionTestCycle);
  const country = s.dealership.country.toUpperCase();
  // The market's own mpg first: US gallons in the US, imperial in the UK.
  const mpgOrder: ConsumptionUnit[] = country === "US" ? ["mpg_us", "mpg_imperial"] : ["mpg_imperial", "mpg_us"];
  const has = (v: unknown) => v !== null && v !== undefined && v !== "";
  const big = unit === "mi";

  const range = rangeText(d.rangeKm, unit, locale);
  const electric = s.fuelType === "plug_in_hybrid" ? rangeText(d.electricRangeKm, unit, locale) : null;

  const vehicle: Row[] = [
    [specLabel("make"), s.make],
    [specLabel("model"), s.model],
    [specLabel("variant"), s.variant],
    [specLabel("buildYear"), yearText(s.buildYear)],
    [specLabel("firstRegistrationDate"), dateText(s.firstRegistrationDate, locale)],
    [specLabel("bodyType"), label("bodyType", s.bodyType)],
    [specLabel("colour"), s.colour],
    [specLabel("doors"), s.doors !== null ? formatNumber(s.doors, o) : null],
    [specLabel("seats"), s.seats !== null ? formatNumber(s.seats, o) : null],
    [
      specLabel("odometerReading"),
      has(s.odometer.reading) ? (
        <>
          <Qty text={odometerText(s.odometer.reading, s.odometer.unit, locale)} />
          {s.inspectedOn ? <span className="font-normal"> on {dateText(s.inspectedOn, locale)}</span> : null}
        </>
      ) : null,
    ],
    [
      "Distance a year",
      d.averageKmPerYear !== null ? (
        <>
          <Qty text={formatDistance(d.averageKmPerYear, unit, o)} /> <span className="font-normal">on average since new</span>
        </>
      ) : null,
    ],
    [specLabel("previousOwners"), s.previousOwners !== null ? formatNumber(s.previousOwners, o) : null],
    [specLabel("keysCount"), s.keysCount !== null ? formatNumber(s.keysCount, o) : null],
    [specLabel("vin"), s.vin ? <span className="break-all font-mono font-normal">{s.vin}</span> : null],
    ["Stock number", <span className="font-mono font-normal">{s.stockNumber}</span>],
  ];

  const engine: Row[] = [
    [specLabel("fuelType"), label("fuelType", s.fuelType)],
    [specLabel("engineCapacityCc"), s.engineCapacityCc !== null ? <Qty text={withUnit(s.engineCapacityCc, "cc", o)} /> : null],
    [specLabel("cylinders"), s.cylinders !== null ? formatNumber(s.cylinders, o) : null],
    [specLabel("aspiration"), label("aspiration", s.aspiration)],
    [specLabel("powerKw"), s.powerKw !== null ? <Several texts={[formatPower(s.powerKw, "kW", o), formatPower(s.powerKw, "hp", o), formatPower(s.powerKw, "PS", o)]} /> : null],
    [specLabel("torqueNm"), s.torqueNm !== null ? <Several texts={[formatTorque(s.torqueNm, "N·m", o), formatTorque(s.torqueNm, "lbf·ft", o)]} /> : null],
    [
      specLabel("transmission"),
      s.transmission ? `${label("transmission", s.transmission)}${s.gears !== null ? `, ${formatNumber(s.gears, o)} gears` : ""}` : null,
    ],
    [specLabel("driveType"), label("driveType", s.driveType)],
    [specLabel("kerbWeightKg"), s.kerbWeightKg !== null ? <Several texts={[formatMass(s.kerbWeightKg, "kg", o), big ? formatMass(s.kerbWeightKg, "lb", o) : null]} /> : null],
    [
      "Power to weight",
      d.powerToWeightKwPerTonne !== null ? (
        <>
          <Qty text={formatPowerToWeight(d.powerToWeightKwPerTonne, o)} /> <span className="font-normal">at kerb weight</span>
        </>
      ) : null,
    ],
  ];

  const economy: Row[] = [
    [specLabel("fuelTankLitres"), s.fuelTankLitres !== null ? <Qty text={withUnit(s.fuelTankLitres, "L", { ...o, fractionDigits: oneDecimalIfNeeded(s.fuelTankLitres) })} /> : null],
    [
      specLabel("fuelConsumptionL100km"),
      s.fuelType !== "electric" && s.fuelConsumptionL100km !== null ? (
        <>
          <Several texts={[formatConsumption(s.fuelConsumptionL100km, "l100km", o), ...mpgOrder.map((u) => formatConsumption(s.fuelConsumptionL100km, u, o))]} />
          {cycle ? <span className="block font-normal">{cycle}</span> : null}
        </>
      ) : null,
    ],
    [specLabel("batteryKwh"), s.batteryKwh !== null ? <Qty text={withUnit(s.batteryKwh, "kWh", { ...o, fractionDigits: oneDecimalIfNeeded(s.batteryKwh) })} /> : null],
    [specLabel("energyKwh100km"), s.energyKwh100km !== null ? <Qty text={withUnit(s.energyKwh100km, "kWh/100\u00a0km", { ...o, fractionDigits: 1 })} /> : null],
    [
      s.fuelType === "electric" ? "Range per charge" : "Range per tank",
      range ? (
        <>
          <Qty text={range} />
          <span className="font-normal">, theoretical{cycle ? `, ${cycle}` : ""}</span>
          <span className="block text-sm font-normal print:hidden">
            {s.fuelType === "electric" ? "Battery capacity ÷ energy use" : "Tank size ÷ fuel use"} on the test figure; real driving usually gives less.
          </span>
        </>
      ) : null,
    ],
    [
      "Electric range",
      electric ? (
        <>
          <Qty text={electric} />
          <span className="font-normal">, theoretical{cycle ? `, ${cycle}` : ""}</span>
        </>
      ) : null,
    ],
    [
      "CO₂",
      d.co2GramsPerKmEstimate !== null ? (
        <>
          <Qty text={formatCo2(d.co2GramsPerKmEstimate, o)} />
          <span className="font-normal">, estimate, not the official figure</span>
          {d.co2Factor ? (
            <span className="block text-sm font-normal">
              Worked out from the fuel use at <Qty text={withUnit(d.co2Factor.gramsPerLitre, "g of CO₂ per litre", o)} />. Source: {d.co2Factor.source}.
            </span>
          ) : null}
        </>
      ) : null,
    ],
  ];

  const group = (title: string, rows: Row[]) => {
    const shown = rows.filter(([, v]) => has(v));
    if (!shown.length) return null;
    return (
      <div className="fr-spec-group min-w-0">
        <h3 className="text-lg font-bold">{title}</h3>
        <dl className="mt-3 grid grid-cols-1 gap-x-6 gap-y-3 sm:grid-cols-2 lg:grid-cols-1">
          {shown.map(([name, value]) => (
            <Fact key={name} name={name}>
              {value}
            </Fact>
          ))}
        </dl>
      </div>
    );
  };

  return (
    <Section id="specification" title="Specification">
      <div className="fr-spec grid grid-cols-1 gap-8 lg:grid-cols-3">
        {group("The vehicle", vehicle)}
        {group("Engine and drive", engine)}
        {group("Economy and range", economy)}
      </div>
      {s.features.length ? (
        <div className="fr-features mt-8">
          <h3 className="text-lg font-bold">{specLabel("features")}</h3>
          <ul className="mt-3 flex flex-wrap gap-2">
            {s.features.map((f) => (
              <li key={f} className="rounded-md border border-line bg-paper-raised px-3 py-1">
                {f}
              </li>
            ))}
          </ul>
        </div>
      ) : null}
    </Section>
  );
}
