import { describe, expect, it } from "vitest";
import {
  THIN_SPACE,
  formatCo2,
  formatConditionIndex,
  formatConsumption,
  formatDistance,
  formatMass,
  formatMoney,
  formatNumber,
  formatPower,
  formatPowerToWeight,
  formatTorque,
  formatTreadDepth,
} from "../../../shared/domain/display.ts";
import { rangeKm } from "../../../shared/domain/range.ts";

const ts = THIN_SPACE;

describe("display rounding", () => {
  it("when 68 L at 8.8 L/100 km is shown, then '773 km' with a thin space (common practice, no source)", () => {
    expect(formatDistance(rangeKm(68, 8.8), "km")).toBe(`773${ts}km`); // TRADE.md §4 (CP): 772.727… → 773 km
    expect(THIN_SPACE).toBe("\u2009");
  });

  it("when the same range is shown in miles, then '480 mi', and 480.2 at 1 dp", () => {
    expect(formatDistance(rangeKm(68, 8.8), "mi")).toBe(`480${ts}mi`); // TRADE.md §4 (CP): 480.2 mi
    expect(formatDistance(rangeKm(68, 8.8), "mi", { fractionDigits: 1 })).toBe(`480.2${ts}mi`);
  });

  it("when 8.8 L/100 km is shown in other units, then 26.73 mpg US, 32.10 mpg UK and 11.36 km/L (2 dp half-up)", () => {
    // TRADE.md §3 worked example
    expect(formatConsumption(8.8, "mpg_us")).toBe(`26.73${ts}mpg US`);
    expect(formatConsumption(8.8, "mpg_imperial")).toBe(`32.10${ts}mpg UK`);
    expect(formatConsumption(8.8, "km_per_l")).toBe(`11.36${ts}km/L`);
    expect(formatConsumption(8.8)).toBe(`8.8${ts}L/100\u00a0km`);
  });

  it("when a value sits exactly on a half, then it rounds half-up", () => {
    expect(formatNumber(26.725, { fractionDigits: 2 })).toBe("26.73");
    expect(formatNumber(2.675, { fractionDigits: 2 })).toBe("2.68");
    expect(formatNumber(772.5)).toBe("773");
    expect(formatNumber(0.125, { fractionDigits: 2 })).toBe("0.13");
  });

  it("when a locale is given, then Intl groups and marks decimals for it", () => {
    expect(formatNumber(160934.4, { locale: "en", fractionDigits: 1 })).toBe("160,934.4");
    expect(formatNumber(160934.4, { locale: "de-DE", fractionDigits: 1 })).toBe("160.934,4");
  });

  it("when power, torque and mass are shown, then the TRADE.md §3 values appear", () => {
    expect(formatPower(73.549875, "PS")).toBe(`100${ts}PS`); // TRADE.md §3: 100 PS = 73.55 kW
    expect(formatPower(150, "hp")).toBe(`201${ts}hp`); // computed by us
    expect(formatPower(150)).toBe(`150${ts}kW`);
    expect(formatTorque(400, "lbf·ft", { fractionDigits: 2 })).toBe(`295.02${ts}lbf·ft`); // TRADE.md §3
    expect(formatMass(1500, "lb", { fractionDigits: 2 })).toBe(`3,306.93${ts}lb`); // TRADE.md §3
  });

  it("when power-to-weight, CO2, tread and the index are shown, then with their own precision", () => {
    expect(formatPowerToWeight(150 / 1.234)).toBe(`121.6${ts}kW/t`);
    expect(formatCo2(236.656)).toBe(`≈${ts}237${ts}g/km`);
    expect(formatTreadDepth(1.5875)).toBe(`1.6${ts}mm`);
    expect(formatConditionIndex(87.4)).toBe("87");
  });

  it("when money is given in cents, then the currency's own decimals are used", () => {
    expect(formatMoney(2_499_000, "AUD", "en-AU")).toBe("$24,990.00");
    expect(formatMoney(2_499_000, "USD", "en-US")).toBe("$24,990.00");
    expect(formatMoney(1_999_950, "GBP", "en-GB")).toBe("£19,999.50");
    expect(formatMoney(2_499_000, "JPY", "ja-JP")).toBe("￥2,499,000");
  });

  it("when a value is missing or not a number, then null, never '0' or 'NaN'", () => {
    expect(formatNumber(null)).toBeNull();
    expect(formatNumber(Number.NaN)).toBeNull();
    expect(formatDistance(null, "km")).toBeNull();
    expect(formatConsumption(0, "mpg_us")).toBeNull();
    expect(formatPower(undefined, "hp")).toBeNull();
    expect(formatMoney(12.5, "USD")).toBeNull();
    expect(formatMoney(100, "NOT-A-CURRENCY")).toBeNull();
  });
});
