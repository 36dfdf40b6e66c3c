import { readFileSync } from "node:fs";
import { en } from "@faker-js/faker";
import { describe, expect, it } from "vitest";
import { demoVehicles, type DemoVehicle } from "../../../server/demo/demo-vehicles.ts";
import { VEHICLE_STATUSES } from "../../../shared/constants/vehicle.ts";
import { dayNumber, parseIsoDate } from "../../../shared/domain/calendar.ts";
import { rangeKm } from "../../../shared/domain/range.ts";
import { analyseServiceHistory, nextService } from "../../../shared/domain/service.ts";
import { vinCheck } from "../../../shared/domain/vin.ts";
import { MODEL_YEAR_CODES } from "../../../shared/domain/vin-model-year.ts";
import { createVehicleSchema } from "../../../shared/schemas/vehicles.ts";

const TODAY = "2026-12-01";
const vehicles = demoVehicles(TODAY);

/**
 * Real makes, used only as a guard: faker's list of vehicle manufacturers (an outside list, never a source of demo
 * data) is what the demo strings are searched for, so no real name has to be written into this repository.
 */
const REAL_MAKES = [...en.vehicle!.manufacturer!];

function allStrings(value: unknown, out: string[] = []): string[] {
  if (typeof value === "string") out.push(value);
  else if (Array.isArray(value)) value.forEach((v) => allStrings(v, out));
  else if (value && typeof value === "object") Object.values(value).forEach((v) => allStrings(v, out));
  return out;
}

const escape = (s: string) => s.replace(/[.*+?^${}()|[\]\\]/g, "\\$&");
const wordPattern = (word: string) => new RegExp(`(^|[^\\p{L}\\p{N}])${escape(word)}($|[^\\p{L}\\p{N}])`, "iu");

const withVin = (v: DemoVehicle) => typeof v.input.vin === "string";
const checkDigitFails = (v: DemoVehicle) =>
  vinCheck(v.input.vin, { checkDigitMandatory: true }).issues.some((issue) => issue.code === "vin_check_digit");

describe("demo vehicles", () => {
  it("when the demo stock is built, then there are exactly 30 vehicles", () => {
    expect(vehicles).toHaveLength(30);
  });

  it.each([TODAY, "2025-03-15", "2024-02-29"])("when every input is parsed with the schema for %s, then it passes unchanged", (today) => {
    const schema = createVehicleSchema(today);
    for (const v of demoVehicles(today)) {
      const result = schema.safeParse(v.input);
      expect(result.error?.issues ?? [], `${v.input.make} ${v.input.model}`).toEqual([]);
      expect(result.data).toEqual(v.input);
    }
  });

  it("when the stock is built twice for the same date, then both are deep-equal", () => {
    expect(demoVehicles(TODAY)).toEqual(demoVehicles(TODAY));
    expect(demoVehicles("2025-03-15")).toEqual(demoVehicles("2025-03-15"));
  });

  it("when the statuses are counted, then every status appears in the planned spread", () => {
    const counts = Object.fromEntries(VEHICLE_STATUSES.map((s) => [s, vehicles.filter((v) => v.status === s).length]));
    expect(counts).toEqual({ intake: 4, preparing: 6, live: 10, reserved: 3, sold: 3, archived: 2, withdrawn: 2 });
  });

  it("when stock ages are read, then all are 1–120 days and sold or archived vehicles have been here longer", () => {
    for (const v of vehicles) {
      expect(v.stockedDaysAgo).toBeGreaterThanOrEqual(1);
      expect(v.stockedDaysAgo).toBeLessThanOrEqual(120);
    }
    const gone = vehicles.filter((v) => v.status === "sold" || v.status === "archived").map((v) => v.stockedDaysAgo);
    const intake = vehicles.filter((v) => v.status === "intake").map((v) => v.stockedDaysAgo);
    expect(Math.min(...gone)).toBeGreaterThan(60);
    expect(Math.max(...intake)).toBeLessThan(Math.min(...gone));
  });

  it("when VINs are checked with the check digit mandatory, then exactly 3 fail the check digit and none fails anything else", () => {
    expect(vehicles.filter(checkDigitFails).map((v) => `${v.input.make} ${v.input.model}`)).toEqual([
      "Lumbrey Sorrel", "Lumbrey Brindle", "Corvane Pimlet",
    ]);
    for (const v of vehicles.filter(withVin)) {
      const codes = vinCheck(v.input.vin, { checkDigitMandatory: true }).issues.map((issue) => issue.code);
      expect(codes.filter((c) => c !== "vin_check_digit")).toEqual([]);
    }
  });

  it("when a VIN is read, then position 7 is a letter and position 10 is the model-year code of the build year", () => {
    for (const v of vehicles.filter(withVin)) {
      const vin = v.input.vin!;
      expect(vin).toMatch(/^[A-HJ-NPR-Z0-9]{17}$/);
      expect(vin[6]).toMatch(/[A-Z]/);
      const first = MODEL_YEAR_CODES[vin[9]];
      expect([first, first + 30]).toContain(v.input.buildYear);
    }
  });

  it("when service histories are analysed, then exactly one vehicle has an odometer reading that goes down", () => {
    const flagged = vehicles.filter((v) => analyseServiceHistory(v.input.serviceHistory).odometerFlags.length > 0);
    expect(flagged.map((v) => `${v.input.make} ${v.input.model}`)).toEqual(["Drovell Cartway"]);
    expect(analyseServiceHistory(flagged[0].input.serviceHistory).odometerFlags).toHaveLength(1);
  });

  it("when service entries are read, then there are 0–8 per vehicle, dated from first registration to today, never above the odometer", () => {
    const today = dayNumber(parseIsoDate(TODAY)!);
    for (const v of vehicles) {
      const history = v.input.serviceHistory ?? [];
      expect(history.length).toBeLessThanOrEqual(8);
      const registered = dayNumber(parseIsoDate(v.input.firstRegistrationDate!)!);
      for (const entry of history) {
        const day = dayNumber(parseIsoDate(entry.date)!);
        expect(day).toBeGreaterThan(registered);
        expect(day).toBeLessThanOrEqual(today);
        expect(entry.odometerKm).toBeLessThanOrEqual(v.input.odometerKm!);
      }
    }
    const kinds = new Set(vehicles.flatMap((v) => (v.input.serviceHistory ?? []).map((e) => e.kind)));
    for (const kind of ["scheduled", "tyres", "repair", "recall", "inspection"]) expect(kinds).toContain(kind);
  });

  it("when the next service is worked out on a 15,000 km / 12-month rule, then at least one vehicle is overdue", () => {
    const overdue = vehicles.filter((v) => nextService(v.input.serviceHistory, v.input.odometerKm, 15_000, 12, TODAY)?.overdue);
    expect(overdue.map((v) => `${v.input.make} ${v.input.model} ${v.input.variant}`)).toContain("Kessamer Yardhand Single cab chassis");
  });

  it("when a vehicle has a 68 L tank at 8.8 L/100 km WLTP, then it exists and its range rounds to 773 km", () => {
    const match = vehicles.find((v) => v.input.fuelTankLitres === 68 && v.input.fuelConsumptionL100km === 8.8 && v.input.consumptionTestCycle === "wltp");
    expect(match).toBeDefined();
    expect(Math.round(rangeKm(match!.input.fuelTankLitres, match!.input.fuelConsumptionL100km)!)).toBe(773);
  });

  it("when an electric vehicle is read, then it has no cylinders, tank or L/100 km and a plausible battery", () => {
    const electric = vehicles.filter((v) => v.input.fuelType === "electric");
    expect(electric.length).toBeGreaterThan(0);
    for (const v of electric) {
      expect(v.input.cylinders).toBe(0);
      expect(v.input.fuelTankLitres ?? null).toBeNull();
      expect(v.input.fuelConsumptionL100km ?? null).toBeNull();
      expect(v.input.batteryKwh).toBeGreaterThanOrEqual(60);
      expect(v.input.batteryKwh).toBeLessThanOrEqual(77);
      expect(v.input.energyKwh100km).toBeGreaterThanOrEqual(15);
      expect(v.input.energyKwh100km).toBeLessThanOrEqual(18);
    }
    const fuels = new Set(vehicles.map((v) => v.input.fuelType));
    for (const fuel of ["petrol", "diesel", "hybrid", "plug_in_hybrid", "electric"]) expect(fuels).toContain(fuel);
    const bodies = new Set(vehicles.map((v) => v.input.bodyType));
    for (const body of ["hatchback", "sedan", "wagon", "suv", "ute", "van"]) expect(bodies).toContain(body);
  });

  it("when build years and odometers are read, then they fit 2012 to today's year at roughly 8,000–25,000 km a year", () => {
    const today = parseIsoDate(TODAY)!;
    for (const v of vehicles) {
      expect(v.input.buildYear).toBeGreaterThanOrEqual(2012);
      expect(v.input.buildYear).toBeLessThanOrEqual(today.year);
      const years = (dayNumber(today) - dayNumber(parseIsoDate(v.input.firstRegistrationDate!)!)) / 365.25;
      if (years >= 1) {
        const perYear = v.input.odometerKm! / years;
        expect(perYear).toBeGreaterThan(7_000);
        expect(perYear).toBeLessThan(27_000);
      }
    }
  });

  it("when an intake record is read, then it is still incomplete (no price or listing copy yet)", () => {
    for (const v of vehicles.filter((x) => x.status === "intake")) {
      expect(v.input.priceCents ?? null).toBeNull();
      expect(v.input.description ?? null).toBeNull();
    }
    for (const v of vehicles.filter((x) => x.status === "live" || x.status === "reserved")) {
      expect(v.input.priceCents).toBeGreaterThanOrEqual(899_000);
      expect(v.input.priceCents).toBeLessThanOrEqual(6_490_000);
      expect(v.input.description).toBeTruthy();
    }
  });

  it("when every string in the data is searched, then none contains a real car make", () => {
    const strings = allStrings(vehicles);
    expect(REAL_MAKES.length).toBeGreaterThanOrEqual(20);
    const hits = REAL_MAKES.flatMap((make) => strings.filter((s) => wordPattern(make).test(s)).map((s) => `${make}: ${s}`));
    expect(hits).toEqual([]);
  });

  it("when makes and models are compared with faker's own lists of real ones, then none matches", () => {
    const real = new Set([...en.vehicle!.manufacturer!, ...en.vehicle!.model!].map((s) => s.toLowerCase()));
    for (const v of vehicles) {
      expect(real.has(v.input.make!.toLowerCase())).toBe(false);
      expect(real.has(v.input.model!.toLowerCase())).toBe(false);
    }
  });

  it("when the seed source is read, then it never calls faker's vehicle module", () => {
    const source = readFileSync(new URL("../../../server/demo/demo-vehicles.ts", import.meta.url), "utf8");
    expect(source).not.toMatch(/\bfaker\s*\.\s*vehicle\b/);
    expect(source).not.toMatch(/\ben\s*\.\s*vehicle\b/);
  });
});
