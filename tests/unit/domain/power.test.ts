import { describe, expect, it } from "vitest";
import { exceedsNswHighPerformance, powerToWeightKwPerTonne } from "../../../shared/domain/power.ts";

describe("powerToWeightKwPerTonne", () => {
  it("when 150 kW on 1,234 kg tare, then 121.56 kW/t and not over 130", () => {
    // TRADE.md §6.1, S [S20] NSW Road Transport (Driver Licensing) Regulation 2017 cl 36(2)(a)
    const pmr = powerToWeightKwPerTonne(150, 1234);
    expect(pmr).toBeCloseTo(121.56, 2);
    expect(exceedsNswHighPerformance(pmr)).toBe(false);
  });

  it("when 130 kW on 1,000 kg, then exactly 130.000 and not over 130 (strict >)", () => {
    // TRADE.md §6.1, S [S20]
    expect(powerToWeightKwPerTonne(130, 1000)).toBe(130);
    expect(exceedsNswHighPerformance(130)).toBe(false);
  });

  it("when the ratio is 130.01, then it counts as over because the PMR is not rounded", () => {
    // TRADE.md §6.1, S [S20]: "130.01 counts as over"
    expect(exceedsNswHighPerformance(130.01)).toBe(true);
  });

  it("when power or mass is missing or zero, then null, never 0", () => {
    expect(powerToWeightKwPerTonne(null, 1234)).toBeNull();
    expect(powerToWeightKwPerTonne(150, 0)).toBeNull();
    expect(powerToWeightKwPerTonne(0, 1234)).toBeNull();
    expect(exceedsNswHighPerformance(null)).toBeNull();
  });
});
