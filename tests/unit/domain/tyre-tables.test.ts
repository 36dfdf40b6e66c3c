import { describe, expect, it } from "vitest";
import { LOAD_INDEX_KG, SPEED_SYMBOLS_KMH, loadIndexToKg, speedSymbolToKmh } from "../../../shared/domain/tyre-tables.ts";

describe("load index table (TRADE.md §2.2, S2 [S16])", () => {
  it("when load index 103 is looked up, then 875 kg, and four tyres carry 3,500 kg", () => {
    expect(loadIndexToKg(103)).toBe(875); // TRADE.md §2.2 test, S2 [S16]
    expect(4 * loadIndexToKg(103)!).toBe(3500); // TRADE.md §2.2 test
  });

  it("when load index 91 is looked up, then 615 kg", () => {
    expect(loadIndexToKg(91)).toBe(615); // TRADE.md §2.2 test, S2 [S16]
  });

  it("when load index 62 is looked up, then 265 kg, not the 165 typo of one public table", () => {
    expect(loadIndexToKg(62)).toBe(265); // TRADE.md §2.2 footnote, S2 [S16]
  });

  it("when the table ends are looked up, then 60 → 250 kg and 130 → 1,900 kg", () => {
    expect(loadIndexToKg(60)).toBe(250); // TRADE.md §2.2, S2 [S16]
    expect(loadIndexToKg(130)).toBe(1900); // TRADE.md §2.2, S2 [S16]
  });

  it("when a load index is outside 60–130 or not an integer, then null (not in table)", () => {
    for (const li of [59, 131, 0, 100.5, Number.NaN]) expect(loadIndexToKg(li)).toBeNull();
    expect(loadIndexToKg(null)).toBeNull();
  });

  it("when the whole table is read, then it has 71 entries that never decrease", () => {
    const values = Array.from({ length: 71 }, (_, i) => LOAD_INDEX_KG[60 + i]);
    expect(Object.keys(LOAD_INDEX_KG)).toHaveLength(71);
    values.slice(1).forEach((kg, i) => expect(kg).toBeGreaterThan(values[i]));
  });
});

describe("speed symbols (TRADE.md §2.3, S2 [S16])", () => {
  it("when H is looked up, then 210 km/h, after U and not by letter order", () => {
    expect(speedSymbolToKmh("H")).toBe(210); // TRADE.md §2.3 test
    expect(SPEED_SYMBOLS_KMH.map(([s]) => s).join("")).toBe("LMNPQRSTUHVWY");
  });

  it("when V is looked up, then 240 km/h", () => {
    expect(speedSymbolToKmh("V")).toBe(240); // TRADE.md §2.3 test
  });

  it("when every symbol is looked up, then the TRADE.md §2.3 table results", () => {
    const expected = { L: 120, M: 130, N: 140, P: 150, Q: 160, R: 170, S: 180, T: 190, U: 200, H: 210, V: 240, W: 270, Y: 300 };
    expect(Object.fromEntries(SPEED_SYMBOLS_KMH)).toEqual(expected);
  });

  it("when a symbol is not in the table, then null", () => {
    expect(speedSymbolToKmh("Z")).toBeNull();
    expect(speedSymbolToKmh("")).toBeNull();
    expect(speedSymbolToKmh(undefined)).toBeNull();
  });
});
