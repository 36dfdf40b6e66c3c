import convert from "convert-units";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  KG_PER_POUND,
  KM_PER_MILE,
  LITRES_PER_IMPERIAL_GALLON,
  LITRES_PER_US_GALLON,
  MPG_IMPERIAL_TIMES_L100KM,
  MPG_US_TIMES_L100KM,
  NEWTON_METRES_PER_LBF_FT,
  WATTS_PER_MECHANICAL_HP,
  WATTS_PER_PS,
  kgToLb,
  kmToMiles,
  kwToHp,
  kwToPs,
  l100kmToKmPerL,
  l100kmToMpgImperial,
  l100kmToMpgUs,
  milesToKm,
  mmToInches,
  mpgImperialToL100km,
  mpgUsToL100km,
  nmToLbft,
  psToKw,
} from "../../../shared/domain/units.ts";

const positive = fc.double({ min: 0.01, max: 1e6, noNaN: true, noDefaultInfinity: true });

describe("unit constants", () => {
  it("when the exact definitions are used, then they are the TRADE.md §3 values", () => {
    expect(LITRES_PER_US_GALLON).toBe(3.785411784); // TRADE.md §3, S2 [S19a]
    expect(LITRES_PER_IMPERIAL_GALLON).toBe(4.54609); // TRADE.md §3, M (from memory): Weights and Measures Act 1985
    expect(KM_PER_MILE).toBe(1.609344); // TRADE.md §3, S2 [S19a]
    expect(KG_PER_POUND).toBe(0.45359237); // TRADE.md §3, S2 [S19a]
    expect(WATTS_PER_PS).toBe(735.49875); // TRADE.md §3, S [S23] schema.org "1 PS = 735,49875 W"
  });

  it("when lbf·ft is derived from lb, g_n and ft, then it is 1.3558179483314 N·m", () => {
    // TRADE.md §3, computed from S2 [S19a] constants: 0.45359237 × 9.80665 × 0.3048
    expect(NEWTON_METRES_PER_LBF_FT).toBeCloseTo(0.45359237 * 9.80665 * 0.3048, 15);
    expect(NEWTON_METRES_PER_LBF_FT).toBeCloseTo(1.3558179483314, 12);
  });

  it("when mechanical hp is derived from 550 ft·lbf/s, then it is 745.69987158227 W", () => {
    // TRADE.md §3, S [S30] pint definition; value computed by us from the same constants
    expect(WATTS_PER_MECHANICAL_HP).toBeCloseTo(550 * NEWTON_METRES_PER_LBF_FT, 10);
    expect(WATTS_PER_MECHANICAL_HP).toBeCloseTo(745.69987158227, 10);
  });

  it("when the fuel-economy constants are formed, then they are 235.214583 and 282.480936", () => {
    expect(MPG_US_TIMES_L100KM).toBeCloseTo(235.214583, 6); // TRADE.md §3 formula
    expect(MPG_IMPERIAL_TIMES_L100KM).toBeCloseTo(282.480936, 6); // TRADE.md §3 formula
  });
});

describe("TRADE.md §3 worked examples (2 dp, half-up)", () => {
  it("when 8.8 L/100 km is converted, then it is 26.73 mpg US, 32.10 mpg UK and 11.36 km/L", () => {
    expect(l100kmToMpgUs(8.8)).toBeCloseTo(26.73, 2); // TRADE.md §3 worked example
    expect(l100kmToMpgImperial(8.8)).toBeCloseTo(32.1, 2); // TRADE.md §3 worked example
    expect(l100kmToKmPerL(8.8)).toBeCloseTo(11.36, 2); // TRADE.md §3 worked example
  });

  it("when 30 mpg US and 40 mpg UK are converted, then they are 7.84 and 7.06 L/100 km", () => {
    expect(mpgUsToL100km(30)).toBeCloseTo(7.84, 2); // TRADE.md §3 worked example
    expect(mpgImperialToL100km(40)).toBeCloseTo(7.06, 2); // TRADE.md §3 worked example
  });

  it("when 100 PS, 400 N·m, 1500 kg and 100,000 mi are converted, then the TRADE.md values result", () => {
    expect(psToKw(100)).toBeCloseTo(73.55, 2); // TRADE.md §3 worked example
    expect(nmToLbft(400)).toBeCloseTo(295.02, 2); // TRADE.md §3 worked example
    expect(kgToLb(1500)).toBeCloseTo(3306.93, 2); // TRADE.md §3 worked example
    expect(milesToKm(100_000)).toBeCloseTo(160_934.4, 6); // TRADE.md §3 worked example
  });

  it("when 150 kW is converted (our own values from the same constants), then 201.15 hp and 203.94 PS", () => {
    // computed by us: 150000 / 745.69987158227 and 150000 / 735.49875
    expect(kwToHp(150)).toBeCloseTo(201.1533, 4);
    expect(kwToPs(150)).toBeCloseTo(203.9432, 4);
  });

  it("when 29.10 in diameter is checked, then 739.2 mm is 29.10 in (TRADE.md §2.1)", () => {
    expect(mmToInches(739.2)).toBeCloseTo(29.1, 2); // TRADE.md §2.1, S2 [S16] worked example
  });
});

describe("convert-units as an independent oracle", () => {
  // convert-units 2.3.4 has length (km, mi), mass (kg, lb) and volume (l, US gal)
  // but no power (hp), torque, imperial gallon or fuel economy units. Its
  // anchors are rounded (1 m = 3.28084 ft, 1 lb = 453.592 g), so agreement is
  // expected to about 5–6 significant figures, not exactly.
  it("when km are converted to miles, then it agrees with convert-units to 1e-6 relative", () => {
    fc.assert(
      fc.property(positive, (km) => {
        const ours = kmToMiles(km)!;
        const theirs = convert(km).from("km").to("mi");
        expect(Math.abs(ours - theirs) / theirs).toBeLessThan(1e-6);
      }),
    );
  });

  it("when kg are converted to pounds, then it agrees with convert-units to 1e-6 relative", () => {
    fc.assert(
      fc.property(positive, (kg) => {
        const theirs = convert(kg).from("kg").to("lb");
        expect(Math.abs(kgToLb(kg)! - theirs) / theirs).toBeLessThan(1e-6);
      }),
    );
  });

  it("when L/100 km → mpg US is rebuilt from convert-units' gallon and mile, then it agrees to 1e-6 relative", () => {
    const litresPerGallon = convert(1).from("gal").to("l");
    const kmPerMile = convert(1).from("mi").to("km");
    fc.assert(
      fc.property(fc.double({ min: 1, max: 40, noNaN: true }), (l100km) => {
        const theirs = (100 * litresPerGallon) / kmPerMile / l100km;
        expect(Math.abs(l100kmToMpgUs(l100km)! - theirs) / theirs).toBeLessThan(1e-6);
      }),
    );
  });

  it("when kW → hp is checked, then convert-units offers no hp unit, so 550 ft·lbf/s is rebuilt from its ft and lb", () => {
    expect(convert().possibilities("power")).not.toContain("hp");
    const metresPerFoot = convert(1).from("ft").to("m");
    const kgPerLb = convert(1).from("lb").to("kg");
    const wattsPerHp = 550 * metresPerFoot * kgPerLb * 9.80665;
    expect(kwToHp(100)!).toBeCloseTo(100_000 / wattsPerHp, 3);
  });
});

describe("unit conversion properties", () => {
  it("when L/100 km is turned into mpg and back, then the value round-trips", () => {
    fc.assert(
      fc.property(positive, (l) => {
        expect(mpgUsToL100km(l100kmToMpgUs(l))!).toBeCloseTo(l, 8);
        expect(mpgImperialToL100km(l100kmToMpgImperial(l))!).toBeCloseTo(l, 8);
      }),
    );
  });

  it("when km are turned into miles and back, then the value round-trips", () => {
    fc.assert(
      fc.property(positive, (km) => {
        expect(Math.abs(milesToKm(kmToMiles(km))! - km)).toBeLessThanOrEqual(km * 1e-12);
      }),
    );
  });

  it("when an input is missing, zero, negative or NaN, then every reciprocal or vehicle conversion is null, never 0 or NaN", () => {
    const bad = [null, undefined, 0, -1, Number.NaN, Number.POSITIVE_INFINITY];
    for (const fn of [l100kmToMpgUs, l100kmToMpgImperial, mpgUsToL100km, mpgImperialToL100km, l100kmToKmPerL, kwToHp, kwToPs, psToKw, nmToLbft, kgToLb]) {
      for (const value of bad) expect(fn(value)).toBeNull();
    }
  });

  it("when a distance is zero, then it converts to zero (a real odometer reading), and negative is null", () => {
    expect(kmToMiles(0)).toBe(0);
    expect(milesToKm(0)).toBe(0);
    expect(kmToMiles(-5)).toBeNull();
    expect(milesToKm(Number.NaN)).toBeNull();
  });
});
