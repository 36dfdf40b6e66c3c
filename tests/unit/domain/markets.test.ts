import { describe, expect, it } from "vitest";
import { MARKET_CODES as STORED_MARKET_CODES } from "../../../shared/constants/market.ts";
import { MARKETS, MARKET_CODES, US_MINIMUM_TREAD_MM, marketPreset } from "../../../shared/domain/markets.ts";

describe("market presets", () => {
  it("when the US minimum is derived from 2/32 in, then it is exactly 1.5875 mm", () => {
    expect(US_MINIMUM_TREAD_MM).toBe(1.5875); // TRADE.md §2.5 inch conversions, exact from 1 in = 25.4 mm
    expect(MARKETS.US.legalMinimumTreadMm).toBe(1.5875); // TRADE.md §2.5, S [S12]
  });

  it("when each market's minimum tread is read, then the TRADE.md §2.5 figure results", () => {
    expect(MARKETS.EU.legalMinimumTreadMm).toBe(1.6); // S [S7] Directive 89/459/EEC
    expect(MARKETS.UK.legalMinimumTreadMm).toBe(1.6); // S2 [S8] C&U Regs 1986 reg 27
    expect(MARKETS.AU.legalMinimumTreadMm).toBe(1.5); // S [S9] WA r 270(2)
    expect(MARKETS.NZ.legalMinimumTreadMm).toBe(1.5); // S2 [S10]
    expect(MARKETS.CA_ON.legalMinimumTreadMm).toBe(1.5); // S [S11] Reg 625 s 3(1)
    expect(MARKETS.CA_QC.legalMinimumTreadMm).toBe(1.6); // S [S11] C-24.2 r. 32 s 159(1)
  });

  it("when the VIN check digit rule is read, then mandatory only in the US and Canada (TRADE.md §1.1, S [S1], S2 [S2])", () => {
    const mandatory = MARKET_CODES.filter((code) => MARKETS[code].vinCheckDigitMandatory);
    expect(mandatory.sort()).toEqual(["CA_ON", "CA_QC", "US"]);
  });

  it("when distance units and currencies are read, then miles in the UK and US and ISO 4217 codes", () => {
    expect(MARKET_CODES.filter((code) => MARKETS[code].distanceUnit === "mi").sort()).toEqual(["UK", "US"]);
    expect(MARKET_CODES.map((code) => MARKETS[code].currency)).toEqual(["EUR", "GBP", "AUD", "NZD", "USD", "CAD", "CAD"]);
  });

  it("when every preset is read, then it names its sources", () => {
    for (const market of Object.values(MARKETS)) {
      expect(market.treadSource).toMatch(/TRADE\.md §2\.5/);
      expect(market.vinSource).toMatch(/TRADE\.md §1\.1/);
    }
  });

  it("when a code is written CA-ON or lower case, then the same preset is found; unknown codes give null", () => {
    expect(marketPreset("CA-ON")).toBe(MARKETS.CA_ON);
    expect(marketPreset("ca_qc")).toBe(MARKETS.CA_QC);
    expect(marketPreset("FR")).toBeNull();
    expect(marketPreset("toString")).toBeNull();
  });

  it("when the stored market codes of shared/constants are listed, then each has a preset", () => {
    for (const code of STORED_MARKET_CODES) expect(marketPreset(code)).not.toBeNull();
  });
});
