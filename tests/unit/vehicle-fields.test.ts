// The vehicle field catalogue (shared/constants/vehicle-field-catalogue.ts) against everything that lists vehicle
// fields: the input schema, the table, the permissions table, the feed columns, the snapshot and the public page.
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { getTableColumns } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import {
  CHANGE_WORDS, FIELD_GROUP_NAMES, FIELD_GROUPS, GROUP_EDITORS, PUBLIC_FIELDS, STAFF_ONLY_FIELDS, STORED_FIELD_NAMES, VEHICLE_FIELDS, VEHICLE_FIELD_NAMES,
  canEditGroup, editActionOf, fieldGroup, forbiddenFields, type FieldSpec,
} from "../../shared/constants/vehicle-fields.ts";
import { ACTIONS, rolesFor } from "../../shared/permissions.ts";
import { ROLES } from "../../shared/constants/roles.ts";
import { vehicleFieldsSchema } from "../../shared/schemas/vehicles.ts";
import { FEED_COLUMNS } from "../../shared/schemas/feeds.ts";
import type { PublicSnapshot } from "../../shared/schemas/public.ts";
import { describeChanges } from "../../shared/domain/revision-changes.ts";
import { computeDerived } from "../../shared/domain/derived.ts";
import { vehicles, type Dealership, type Vehicle } from "../../server/db/schema/index.ts";
import { buildSnapshot } from "../../server/modules/publishing/snapshot.ts";
import type { Evidence } from "../../server/modules/condition/condition.presenter.ts";
import { Specifications } from "../../src/features/storefront/components/condition/Specifications.tsx";

const spec = (f: string) => (VEHICLE_FIELDS as Record<string, FieldSpec>)[f];
const PLATE = "QX 4471";

// A plug-in hybrid with every field recorded, so every row of the public specification shows.
const fields = {
  vin: "1G4AH59H45G118341", registrationPlate: PLATE, make: "Corvane", model: "Tessel", buildYear: 2021, variant: "1.6 plug-in", firstRegistrationDate: "2021-04-12",
  colour: "Moss green", bodyType: "suv", doors: 5, seats: 5, driveType: "awd", fuelType: "plug_in_hybrid", engineCapacityCc: 1598, cylinders: 4, aspiration: "turbo",
  powerKw: 195, torqueNm: 350, transmission: "automatic", gears: 6, kerbWeightKg: 1840, fuelTankLitres: 42, fuelConsumptionL100km: 1.4,
  consumptionTestCycle: "wltp", batteryKwh: 13.8, energyKwh100km: 17.9, odometerReading: 38_140, odometerUnit: "km", keysCount: 2, previousOwners: 1,
  serviceHistory: [{ date: "2024-04-02", odometerKm: 30_000, kind: "scheduled", workshop: "Quarry Lane Workshop", notes: "" }],
  description: "One owner.", features: ["Tow bar", "Heated seats"], priceCents: 3_150_000,
} satisfies Record<(typeof STORED_FIELD_NAMES)[number], unknown>;

const dealership = {
  name: "Fernhollow Motors", slug: "fernhollow", addressLine: "2 Mill Row", town: "Tallowbridge", region: "", postcode: "TB1 2MR", country: "nz",
  licenceNumber: "", phone: "", email: "", website: "", locale: "en-NZ", currency: "NZD", distanceUnit: "km", timeZone: "Pacific/Auckland",
  disclaimerMarkdown: "", vinCheckDigitMandatory: false, serviceIntervalKm: 15_000, serviceIntervalMonths: 12,
} as unknown as Dealership;

const evidence = {
  photos: [], defects: [], zones: [], cautions: [],
  tyres: { measuredOn: null, legalMinTreadMm: 1.5, readings: [] },
  checks: { results: [] },
  condition: { index: null, summary: { sentence: "", bySeverity: {}, byZone: {} }, explanation: [] },
} as unknown as Evidence;

function snapshotOf(over: Record<string, unknown> = {}): PublicSnapshot {
  const row = {
    id: 1, dealershipId: 1, stockNumber: "FH-0101", status: "live", ...fields, odometerKmIndex: fields.odometerReading,
    stockedAt: new Date("2025-01-10T00:00:00Z"), createdAt: new Date("2025-01-10T00:00:00Z"), updatedAt: new Date("2025-01-10T00:00:00Z"), version: 1, ...over,
  } as unknown as Vehicle;
  const derived = computeDerived({ ...row, odometerKm: row.odometerKmIndex }, { today: "2025-06-20", checkDigitMandatory: false });
  return buildSnapshot(row, derived, evidence, dealership);
}

/** Where a public field lands in the snapshot: under its own name, except the odometer (one object) and the copy (rendered). */
function inSnapshot(s: PublicSnapshot, f: string): unknown {
  const odometer: Record<string, unknown> = { odometerReading: s.odometer.reading, odometerUnit: s.odometer.unit, odometerKm: s.odometer.km };
  if (f in odometer) return odometer[f];
  if (f === "description") return s.descriptionHtml;
  return (s as unknown as Record<string, unknown>)[f];
}

describe("the vehicle field catalogue", () => {
  it("when compared with the vehicle input schema, then it names exactly its fields", () => {
    const schemaFields = Object.keys(vehicleFieldsSchema("2025-06-20").shape);
    expect([...VEHICLE_FIELD_NAMES].sort()).toEqual([...schemaFields].sort());
  });

  it("when the groups are read, then every catalogued field is in exactly one of the six, and every group's field is catalogued", () => {
    expect(Object.keys(FIELD_GROUPS)).toEqual([...FIELD_GROUP_NAMES]);
    const grouped = Object.values(FIELD_GROUPS).flat();
    expect([...grouped].sort()).toEqual([...VEHICLE_FIELD_NAMES].sort());
    expect(new Set(grouped).size).toBe(grouped.length);
    for (const [g, names] of Object.entries(FIELD_GROUPS)) for (const f of names) expect(fieldGroup(f)).toBe(g);
  });

  it("when a field is stored, then the vehicles table has a column of its name (the odometer in km is the index column)", () => {
    const columns = Object.keys(getTableColumns(vehicles));
    for (const f of STORED_FIELD_NAMES) expect(columns, f).toContain(f);
    expect(columns).toContain("odometerKmIndex");
  });

  it("when a role edits a group, then the permissions table's vehicle.<group>.edit decides, and no second role list exists", () => {
    for (const g of FIELD_GROUP_NAMES) {
      expect(ACTIONS).toContain(editActionOf(g));
      expect(GROUP_EDITORS[g]).toEqual(rolesFor(editActionOf(g)));
      for (const role of ROLES) expect(canEditGroup(role, g)).toBe(rolesFor(editActionOf(g)).includes(role));
    }
  });

  it("when workshop or marketing save, then only their groups pass (../shared/PRODUCT.md roles)", () => {
    expect(forbiddenFields("workshop", ["powerKw", "odometerReading", "fuelTankLitres", "serviceHistory"])).toEqual([]);
    expect(forbiddenFields("workshop", ["priceCents", "description", "vin"])).toEqual(["priceCents", "description", "vin"]);
    expect(forbiddenFields("marketing", ["description", "features", "priceCents", "odometerReading"])).toEqual(["priceCents", "odometerReading"]);
    expect(forbiddenFields("sales", [...VEHICLE_FIELD_NAMES])).toEqual([]);
    expect(forbiddenFields("admin", ["notAField"])).toEqual(["notAField"]);
  });

  it("when a field is public, then it is on no staff-only list, and only public fields have buyer words or feed columns", () => {
    for (const f of PUBLIC_FIELDS) expect(STAFF_ONLY_FIELDS).not.toContain(f);
    expect([...PUBLIC_FIELDS, ...STAFF_ONLY_FIELDS].sort()).toEqual([...VEHICLE_FIELD_NAMES].sort());
    expect(STAFF_ONLY_FIELDS).toContain("registrationPlate");
    for (const f of STAFF_ONLY_FIELDS) {
      const s = spec(f);
      expect(s.spec ?? s.change ?? s.feed, f).toBeUndefined();
    }
  });

  it("when a revision snapshot is built, then every public field is in it and no staff-only value is", () => {
    const s = snapshotOf();
    for (const f of PUBLIC_FIELDS) {
      expect(inSnapshot(s, f), f).toBeDefined();
      expect(inSnapshot(s, f), f).not.toBeNull();
    }
    expect(JSON.stringify(s)).not.toContain(PLATE);
    for (const f of STAFF_ONLY_FIELDS) expect(f in s, f).toBe(false);
  });

  it("when a field has a feed column, then the feed catalogue carries it under the field's label", () => {
    const byKey = new Map<string, string>(FEED_COLUMNS.map((c) => [c.key, c.label]));
    const withFeed = VEHICLE_FIELD_NAMES.filter((f) => spec(f).feed);
    // 30 vehicle fields have a feed column (the feed catalogue's field columns, shared/schemas/feeds.ts).
    expect(withFeed.length).toBe(30);
    for (const f of withFeed) expect(byKey.get(spec(f).feed!.column), f).toBe(spec(f).feed!.label);
    // The labels portals and marketing already knew.
    expect(byKey.get("fuelTankLitres")).toBe("Fuel tank (L)");
    expect(byKey.get("bodyType")).toBe("Body type");
    expect(byKey.get("fuelConsumption")).toBe("Fuel consumption (in the feed's units)");
    expect(byKey.get("descriptionHtml")).toBe("Description (HTML)");
  });

  it("when every named field changes between revisions, then the sentence names them in the order and words it always did", () => {
    for (const [f] of CHANGE_WORDS) expect(f in snapshotOf(), f).toBe(true);
    const prev = snapshotOf();
    const was = (f: string) => (prev as unknown as Record<string, unknown>)[f];
    const changed = Object.fromEntries(CHANGE_WORDS.map(([f]) => [f, typeof was(f) === "number" ? (was(f) as number) + 1 : `${String(was(f))}x`]));
    const next = { ...prev, ...changed };
    expect(describeChanges(prev, next)).toEqual([
      "Specification updated: VIN, build year, variant, colour, body, doors, seats, drive, fuel, engine capacity, cylinders, power, torque, transmission, " +
        "gears, kerb weight, tank size, fuel consumption, test cycle, battery, energy use, keys, previous owners.",
    ]);
  });

  it("when the public specification renders, then its rows keep the names buyers read", () => {
    const html = renderToStaticMarkup(createElement(Specifications, { snapshot: snapshotOf(), locale: "en-NZ" }));
    const rows = [...html.matchAll(/<dt[^>]*>(.*?)<\/dt>/g)].map((m) => m[1]);
    expect(rows).toEqual([
      "Make", "Model", "Variant", "Build year", "First registered", "Body", "Colour", "Doors", "Seats", "Odometer, as read", "Distance a year", "Previous owners",
      "Keys", "VIN", "Stock number",
      "Fuel", "Engine", "Cylinders", "Aspiration", "Power", "Torque", "Gearbox", "Drive", "Kerb weight", "Power to weight",
      "Fuel tank", "Fuel use", "Battery", "Energy use", "Range per tank", "Electric range", "CO₂",
    ]);
    expect(html).toContain(">Features</h3>");
  });
});
