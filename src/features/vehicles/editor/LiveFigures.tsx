import type { Derived } from "../../../../shared/domain/derived.ts";
import {
  formatConsumption, formatCo2, formatDistance, formatNumber, formatPower, formatPowerToWeight, formatTorque, THIN_SPACE,
} from "../../../../shared/domain/display.ts";
import type { FieldGroup } from "../../../../shared/constants/vehicle-fields.ts";
import { LABELS } from "../../../../shared/constants/vehicle.ts";

export interface LiveInput {
  powerKw: number | null;
  torqueNm: number | null;
  fuelConsumptionL100km: number | null;
  buildYear: number | null;
}

function Figure({ label, value, note }: { label: string; value: string | null; note?: string }) {
  return (
    <div className="flex flex-col">
      <dt className="text-xs font-bold uppercase tracking-wide text-ink-soft">{label}</dt>
      <dd className="figures text-lg font-bold">{value ?? <span className="font-normal text-ink-faint">needs inputs</span>}</dd>
      {note ? <dd className="text-xs text-ink-soft">{note}</dd> : null}
    </div>
  );
}

/** The figures the server will compute, shown as the fields are filled, with the same shared functions. */
export function LiveFigures({ group, derived, input, locale, distanceUnit }: { group: FieldGroup; derived: Derived; input: LiveInput; locale: string; distanceUnit: "km" | "mi" }) {
  const o = { locale };
  const cycle = derived.consumptionTestCycle ? (LABELS.consumptionTestCycle as Record<string, string>)[derived.consumptionTestCycle] : "test cycle not stated";
  let items: Array<{ label: string; value: string | null; note?: string }> = [];
  if (group === "identity") {
    items = [
      {
        label: "VIN check",
        value: derived.vinCheck === "not_applicable" ? "No VIN entered" : derived.vinCheck === "valid" ? "Check digit correct" : "Check digit does not match",
        note: derived.vinIssues.map((i) => i.message).join(" ") || undefined,
      },
      {
        label: "Model year from VIN",
        value: derived.modelYearFromVin ? String(derived.modelYearFromVin) : null,
        note:
          [
            derived.modelYearAmbiguous && derived.modelYearCandidates.length > 1
              ? `Could also be ${derived.modelYearCandidates.filter((y) => y !== derived.modelYearFromVin).join(" or ")}; confirm on the compliance plate.`
              : null,
            derived.modelYearFromVin && input.buildYear && Math.abs(derived.modelYearFromVin - input.buildYear) > 1
              ? `The build year says ${input.buildYear}. Check the VIN was read correctly; outside North America position 10 may not encode the year.`
              : null,
          ]
            .filter(Boolean)
            .join(" ") || undefined,
      },
    ];
  } else if (group === "specification") {
    items = [
      { label: "Power", value: derived.powerHp != null ? `${formatPower(input.powerKw, "hp", o)} · ${formatPower(input.powerKw, "PS", o)}` : null },
      { label: "Torque", value: derived.torqueLbft != null ? formatTorque(input.torqueNm, "lbf·ft", o) : null },
      { label: "Power to weight", value: formatPowerToWeight(derived.powerToWeightKwPerTonne, { ...o, fractionDigits: 1 }), note: derived.powerToWeightKwPerTonne != null ? "kerb mass" : undefined },
    ];
  } else if (group === "economy") {
    const l100 = derived.mpgUs != null ? input.fuelConsumptionL100km : null;
    items = [
      { label: "Theoretical range", value: formatDistance(derived.rangeKm, distanceUnit, { ...o, approximate: true }), note: derived.rangeKm != null ? `per full tank or charge, on ${cycle}` : undefined },
      ...(derived.electricRangeKm != null && derived.rangeKm !== derived.electricRangeKm
        ? [{ label: "Electric range", value: formatDistance(derived.electricRangeKm, distanceUnit, { ...o, approximate: true }), note: `theoretical, on ${cycle}` }]
        : []),
      { label: "Economy", value: l100 != null ? `${formatConsumption(l100, "mpg_us", { ...o, fractionDigits: 1 })} · ${formatConsumption(l100, "mpg_imperial", { ...o, fractionDigits: 1 })}` : null },
      { label: "CO₂ estimate", value: formatCo2(derived.co2GramsPerKmEstimate, o), note: derived.co2Factor ? `An estimate from fuel use (${derived.co2Factor.source}); not the official figure.` : undefined },
    ];
  } else if (group === "history") {
    const ns = derived.nextService;
    items = [
      { label: "Average per year", value: derived.averageKmPerYear != null ? `${formatNumber(derived.averageKmPerYear, o)}${THIN_SPACE}km` : null },
      {
        label: "Next service due",
        value: ns ? [ns.dueByDate, ns.dueByKm != null ? `${formatNumber(ns.dueByKm, o)}${THIN_SPACE}km` : null].filter(Boolean).join(" or ") : null,
        note: ns ? (ns.overdue ? "Overdue: book it before sale or disclose it." : "whichever comes first") : "Add a scheduled service to work this out.",
      },
    ];
  }
  if (!items.length) return null;
  return (
    <dl className="grid gap-4 self-start rounded-md border border-dashed border-line-strong bg-paper p-4 sm:grid-cols-2 lg:grid-cols-1" aria-label="Worked out from these fields" aria-live="polite">
      {items.map((i) => (
        <Figure key={i.label} {...i} />
      ))}
    </dl>
  );
}
