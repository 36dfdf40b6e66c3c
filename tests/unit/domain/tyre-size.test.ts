import { describe, expect, it } from "vitest";
import { parseTyreSize, type TyreSize } from "../../../shared/domain/tyres.ts";

function parsed(input: string): TyreSize {
  const result = parseTyreSize(input);
  if (!result.ok) throw new Error(`expected ${input} to parse: ${result.error.message}`);
  return result.tyre;
}

describe("parseTyreSize", () => {
  it("when 235/60 R18 103V is parsed, then its parts, load and speed come out", () => {
    const t = parsed("235/60 R18 103V"); // TRADE.md §2.1 table, S2 [S16]
    expect(t).toMatchObject({
      widthMm: 235,
      aspectRatio: 60,
      construction: "radial",
      rimInches: 18,
      loadIndex: 103,
      loadIndexDual: null,
      loadKg: 875, // TRADE.md §2.2, S2 [S16]
      speedSymbol: "V",
      speedKmh: 240, // TRADE.md §2.3, S2 [S16]
    });
  });

  it("when 235/60 R18 geometry is computed, then 141.0 mm sidewall, 739.2 mm diameter, 2322.3 mm round, 430.6 rev/km", () => {
    // TRADE.md §2.1 worked example, S2 [S16]
    const t = parsed("235/60 R18 103V");
    expect(t.overallDiameterMm - 18 * 25.4).toBeCloseTo(2 * 141.0, 6);
    expect(t.overallDiameterMm).toBeCloseTo(739.2, 1);
    expect(t.overallDiameterMm / 25.4).toBeCloseTo(29.1, 2);
    expect(t.circumferenceMm).toBeCloseTo(2322.3, 1);
    expect(t.revsPerKm).toBeCloseTo(430.6, 1);
  });

  it("when 205/55R16 91H is parsed (no spaces), then 615 kg and 210 km/h", () => {
    const t = parsed("205/55R16 91H");
    expect(t).toMatchObject({ widthMm: 205, aspectRatio: 55, rimInches: 16, loadKg: 615, speedKmh: 210 });
    expect(t.overallDiameterMm).toBeCloseTo(631.9, 6); // computed by us: 16 × 25.4 + 2 × 205 × 0.55
  });

  it("when 235/60ZR18 has no service description, then ZR is flagged with the ask-the-maker note", () => {
    const t = parsed("235/60ZR18");
    expect(t.flags.zr).toBe(true);
    expect(t.speedKmh).toBeNull();
    expect(t.loadIndex).toBeNull();
    expect(t.notes.map((n) => n.code)).toContain("zr_without_service_description"); // TRADE.md §2.3, S2
  });

  it("when LT265/75R16 123/120Q is parsed, then light truck with a dual load index", () => {
    const t = parsed("LT265/75R16 123/120Q");
    expect(t).toMatchObject({ prefix: "LT", loadIndex: 123, loadIndexDual: 120, loadKg: 1550, loadKgDual: 1400, speedKmh: 160 });
    expect(t.flags.lightTruck).toBe(true);
  });

  it("when 215/65 R16C 109/107T is parsed, then commercial with 1,030/975 kg", () => {
    const t = parsed("215/65 R16C 109/107T");
    expect(t).toMatchObject({ rimInches: 16, loadIndex: 109, loadIndexDual: 107, loadKg: 1030, loadKgDual: 975, speedKmh: 190 });
    expect(t.flags.commercial).toBe(true);
  });

  it("when XL, Extra Load or Reinforced is written, then separate flags are set (TRADE.md §2.2, M, from memory)", () => {
    expect(parsed("225/45 R17 94W XL").flags.extraLoad).toBe(true);
    expect(parsed("225/45R17 XL 94W").flags.extraLoad).toBe(true);
    expect(parsed("225/45 R17 94W Extra Load").flags).toMatchObject({ extraLoad: true, reinforced: false });
    expect(parsed("225/45 R17 94W REINFORCED").flags).toMatchObject({ extraLoad: false, reinforced: true });
  });

  it("when the speed symbol is bracketed (Y), then above 300 km/h is flagged", () => {
    expect(parsed("255/35 ZR19 (96Y)").flags.speedAbove300).toBe(true);
    expect(parsed("255/35 ZR19 96(Y)").flags.speedAbove300).toBe(true);
    expect(parsed("255/35 ZR19 96Y").flags.speedAbove300).toBe(false);
  });

  it("when V, W or Y is the symbol, then the high-speed load note is shown (TRADE.md §2.2, M, from memory)", () => {
    expect(parsed("235/60 R18 103V").notes.map((n) => n.code)).toContain("high_speed_load_reduction");
    expect(parsed("205/55R16 91H").notes.map((n) => n.code)).not.toContain("high_speed_load_reduction");
  });

  it("when the load index is outside the table, then the size parses with loadKg null and a note", () => {
    const t = parsed("315/80 R22.5 156L");
    expect(t.rimInches).toBe(22.5);
    expect(t.loadKg).toBeNull();
    expect(t.notes.map((n) => n.code)).toContain("load_index_not_in_table");
  });

  it("when lower case and odd spacing are used, then the size still parses", () => {
    expect(parsed("  235 / 60  r18  103v ").designation).toBe("235/60 R18 103V");
    expect(parsed("235/60 R18 103 V")).toMatchObject({ loadIndex: 103, speedSymbol: "V" });
  });

  it("when the text is not a metric size, then an error", () => {
    expect(parseTyreSize("")).toMatchObject({ ok: false, error: { code: "empty" } });
    expect(parseTyreSize(null)).toMatchObject({ ok: false, error: { code: "empty" } });
    expect(parseTyreSize("31x10.50R15")).toMatchObject({ ok: false, error: { code: "unrecognised_format" } });
    expect(parseTyreSize("000/60 R18")).toMatchObject({ ok: false, error: { code: "invalid_dimension" } });
  });
});
