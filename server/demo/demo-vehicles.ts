/**
 * The demo stock of Fernhollow Motors (./demo.ts): 30 vehicles in every status, built relative to `today` so the
 * data never dates. Every make, model, workshop and plate here is invented; the makes and models are our own words
 * and faker's vehicle module is never used (it lists real brands; ../../../shared/PRODUCT.md "Demo scenario").
 *
 * Invented makes and models: Corvane Pimlet and Dapple, Ambrel Loam and Brackle, Vantrel Ohmra and Sparrel,
 * Kessamer Yardhand, Drovell Cartway, Lumbrey Sorrel and Brindle.
 *
 * Deliberate flaws, so the product's checks have something to find:
 * - three VINs carry a wrong check digit (index 3 Lumbrey Sorrel, index 8 Lumbrey Brindle, index 21 Corvane Pimlet);
 * - one service history has an odometer reading that goes down (index 6, Drovell Cartway van);
 * - one service history stops long before we stocked the vehicle, so its service is overdue (index 13, Kessamer
 *   Yardhand cab chassis);
 * - the intake records are incomplete (no price, no listing copy, some specification missing).
 */
import { Faker, en } from "@faker-js/faker";
import type { VehicleStatus } from "../../shared/constants/vehicle.ts";
import { LABELS } from "../../shared/constants/vehicle.ts";
import { addMonths, dayNumber, formatIsoDate, fromDayNumber, parseIsoDate, type CalendarDate } from "../../shared/domain/calendar.ts";
import type { ServiceKind } from "../../shared/domain/service.ts";
import { computeCheckDigit } from "../../shared/domain/vin.ts";
import { MODEL_YEAR_CODES } from "../../shared/domain/vin-model-year.ts";
import type { CreateVehicleInput, ServiceEntryInput } from "../../shared/schemas/vehicles.ts";

export interface DemoVehicle {
  input: CreateVehicleInput;
  status: VehicleStatus;
  stockedDaysAgo: number;
}

type Field = keyof CreateVehicleInput;

/** The specification a model line fixes: these fields, in this order (the columns of the table below). */
const SPEC_FIELDS = [
  "bodyType", "doors", "seats", "driveType", "fuelType", "engineCapacityCc", "cylinders", "aspiration", "powerKw",
  "torqueNm", "transmission", "gears", "fuelTankLitres", "fuelConsumptionL100km", "consumptionTestCycle",
  "batteryKwh", "energyKwh100km", "kerbWeightKg",
] as const satisfies readonly Field[];
type Spec = Pick<CreateVehicleInput, (typeof SPEC_FIELDS)[number]>;
type RowOf<F extends readonly (keyof Spec)[]> = { -readonly [I in keyof F]: Spec[F[I]] };
type SpecRow = RowOf<typeof SPEC_FIELDS>;

/** One row of the table as a Spec, its keys in SPEC_FIELDS order (the vehicle input spreads it, so the order shows). */
const spec = (row: SpecRow): Spec => Object.fromEntries(SPEC_FIELDS.map((field, i) => [field, row[i]] as const));

interface Line {
  make: string;
  model: string;
  variant: string;
  /**
   * VIN positions 1–3. All invented: "Z9" followed by the make's initial. None is a manufacturer identifier we know
   * of; the demo never uses a real maker's WMI.
   */
  wmi: string;
  /** VIN positions 4–8 (vehicle attributes); position 7 (the fourth character here) is a letter, as from 2010. */
  vds: string;
  /** VIN position 11 (plant). */
  plant: string;
  spec: Spec;
  newPriceCents: number;
  features: string[];
}

// eslint-disable-next-line max-len -- the table's header, aligned with its columns
//                            body         doors seats drive  fuel              cc    cyl aspiration kW   N·m  gearbox        gears tank  l/100 cycle   kWh   kWh/100 kerb
const petrolHatch     = spec(["hatchback", 5,    5,    "fwd", "petrol",         1199, 3,  "turbo",   74,  160, "manual",      5,    40,   5.1,  "wltp", null, null,   1050]);
const hybridHatch     = spec(["hatchback", 5,    5,    "fwd", "hybrid",         1798, 4,  "natural", 90,  142, "cvt",         null, 43,   4.2,  "wltp", null, null,   1370]);
const dieselSevenSeat = spec(["suv",       5,    7,    "awd", "diesel",         2199, 4,  "turbo",   147, 440, "automatic",   8,    68,   8.8,  "wltp", null, null,   1930]);
const petrolMidSuv    = spec(["suv",       5,    5,    "awd", "petrol",         1998, 4,  "natural", 115, 200, "cvt",         null, 55,   7.4,  "wltp", null, null,   1520]);
const electricSuv     = spec(["suv",       5,    5,    "rwd", "electric",       null, 0,  null,      150, 350, "automatic",   1,    null, null, "wltp", 64,   15.8,   1850]);
const plugInSuv       = spec(["suv",       5,    5,    "awd", "plug_in_hybrid", 1498, 4,  "turbo",   188, 400, "automatic",   6,    55,   1.9,  "wltp", 18,   19.5,   1870]);
const dieselUte       = spec(["ute",       4,    5,    "4wd", "diesel",         2755, 4,  "turbo",   150, 500, "automatic",   6,    80,   7.9,  "nedc", null, null,   2100]);
const dieselVan       = spec(["van",       4,    3,    "fwd", "diesel",         1995, 4,  "turbo",   110, 340, "manual",      6,    70,   7.6,  "nedc", null, null,   1890]);
const petrolSedan     = spec(["sedan",     4,    5,    "fwd", "petrol",         2488, 4,  "natural", 135, 235, "automatic",   6,    60,   7.3,  "nedc", null, null,   1480]);
const dieselWagon     = spec(["wagon",     5,    5,    "awd", "diesel",         1968, 4,  "turbo",   110, 340, "dual_clutch", 7,    66,   5.4,  "nedc", null, null,   1610]);

const UTE_FEATURES = ["Tow bar", "Tub liner", "Rear diff lock", "Side steps", "Hill descent control"];
const VAN_FEATURES = ["Cargo barrier", "Sliding side door", "Rubber cargo floor", "Rear barn doors"];
const EV_FEATURES = ["Heat pump", "Type 2 charging cable", "DC fast charging", "Vehicle-to-load adaptor", "One-pedal driving"];

const LINES = {
  pimletBase: {
    make: "Corvane", model: "Pimlet", variant: "Base", wmi: "Z9C", vds: "PM1A5", plant: "T",
    spec: petrolHatch, newPriceCents: 2_499_000, features: ["Air conditioning"],
  },
  pimletSport: {
    make: "Corvane", model: "Pimlet", variant: "Sport", wmi: "Z9C", vds: "PM2B5", plant: "T",
    spec: { ...petrolHatch, transmission: "dual_clutch", gears: 7, fuelConsumptionL100km: 5.3, kerbWeightKg: 1085 },
    newPriceCents: 2_899_000, features: ["Alloy wheels", "Rear spoiler"],
  },
  dappleHatch: {
    make: "Corvane", model: "Dapple", variant: "Hybrid hatch", wmi: "Z9C", vds: "TS1H6", plant: "T",
    spec: hybridHatch, newPriceCents: 3_399_000, features: ["Regenerative braking display"],
  },
  dappleSedan: {
    make: "Corvane", model: "Dapple", variant: "Hybrid sedan", wmi: "Z9C", vds: "TS2H6", plant: "T",
    spec: { ...hybridHatch, bodyType: "sedan", doors: 4, fuelConsumptionL100km: 4.1, kerbWeightKg: 1390 },
    newPriceCents: 3_499_000, features: ["Regenerative braking display"],
  },
  loamField: {
    make: "Ambrel", model: "Loam", variant: "Field", wmi: "Z9A", vds: "LM7D8", plant: "K",
    spec: dieselSevenSeat, newPriceCents: 5_990_000, features: ["Third-row seats", "Third-row air vents", "Tow bar"],
  },
  loamCrest: {
    make: "Ambrel", model: "Loam", variant: "Crest", wmi: "Z9A", vds: "LM7E8", plant: "K",
    spec: { ...dieselSevenSeat, kerbWeightKg: 1965 },
    newPriceCents: 6_990_000, features: ["Third-row seats", "Third-row air vents", "Leather-look trim", "Sunroof"],
  },
  brackleAwd: {
    make: "Ambrel", model: "Brackle", variant: "AWD", wmi: "Z9A", vds: "FN3C5", plant: "K",
    spec: petrolMidSuv, newPriceCents: 3_990_000, features: ["Roof rails"],
  },
  brackleHybrid: {
    make: "Ambrel", model: "Brackle", variant: "Hybrid", wmi: "Z9A", vds: "FN4H5", plant: "K",
    spec: { ...petrolMidSuv, fuelType: "hybrid", driveType: "fwd", engineCapacityCc: 2487, powerKw: 160, torqueNm: 221, fuelConsumptionL100km: 4.8, kerbWeightKg: 1640 },
    newPriceCents: 4_490_000, features: ["Roof rails", "Regenerative braking display"],
  },
  ohmra64: {
    make: "Vantrel", model: "Ohmra", variant: "64 kWh", wmi: "Z9V", vds: "HM1E0", plant: "W",
    spec: electricSuv, newPriceCents: 5_790_000, features: EV_FEATURES.slice(0, 3),
  },
  ohmra77: {
    make: "Vantrel", model: "Ohmra", variant: "77 kWh", wmi: "Z9V", vds: "HM2E0", plant: "W",
    spec: { ...electricSuv, powerKw: 160, batteryKwh: 77, energyKwh100km: 17.2, kerbWeightKg: 1960 },
    newPriceCents: 6_590_000, features: EV_FEATURES,
  },
  sparrel: {
    make: "Vantrel", model: "Sparrel", variant: "Plug-in AWD", wmi: "Z9V", vds: "SP3P4", plant: "W",
    spec: plugInSuv, newPriceCents: 6_390_000, features: ["Type 2 charging cable", "Electric-only mode", "Heat pump"],
  },
  yardhandDual: {
    make: "Kessamer", model: "Yardhand", variant: "Worksite dual cab", wmi: "Z9K", vds: "YD4U2", plant: "R",
    spec: dieselUte, newPriceCents: 5_890_000, features: UTE_FEATURES,
  },
  yardhandDualManual: {
    make: "Kessamer", model: "Yardhand", variant: "Worksite dual cab manual", wmi: "Z9K", vds: "YD4U1", plant: "R",
    spec: { ...dieselUte, transmission: "manual", gears: 6, fuelConsumptionL100km: 7.6 },
    newPriceCents: 5_590_000, features: UTE_FEATURES,
  },
  yardhandCab: {
    make: "Kessamer", model: "Yardhand", variant: "Single cab chassis", wmi: "Z9K", vds: "YS2C1", plant: "R",
    spec: { ...dieselUte, bodyType: "cab_chassis", doors: 2, seats: 3, transmission: "manual", gears: 6, kerbWeightKg: 1850, fuelConsumptionL100km: 7.7 },
    newPriceCents: 4_690_000, features: ["Tow bar", "Alloy tray", "Headboard", "Rear diff lock"],
  },
  cartwayVan: {
    make: "Drovell", model: "Cartway", variant: "Panel van LWB", wmi: "Z9D", vds: "CW5V3", plant: "H",
    spec: dieselVan, newPriceCents: 5_190_000, features: VAN_FEATURES,
  },
  cartwayCrew: {
    make: "Drovell", model: "Cartway", variant: "Crew", wmi: "Z9D", vds: "CW6W3", plant: "H",
    spec: { ...dieselVan, bodyType: "people_mover", doors: 5, seats: 8, transmission: "automatic", gears: 8, fuelConsumptionL100km: 8.1, kerbWeightKg: 2050 },
    newPriceCents: 5_990_000, features: ["Sliding side door", "Rear air conditioning", "Third-row seats"],
  },
  sorrelSedan: {
    make: "Lumbrey", model: "Sorrel", variant: "Touring", wmi: "Z9L", vds: "SR1S4", plant: "M",
    spec: petrolSedan, newPriceCents: 3_790_000, features: [],
  },
  sorrelCoupe: {
    make: "Lumbrey", model: "Sorrel", variant: "Coupe", wmi: "Z9L", vds: "SR3K2", plant: "M",
    spec: { ...petrolSedan, bodyType: "coupe", doors: 2, seats: 4, powerKw: 147, torqueNm: 250, transmission: "manual", gears: 6, fuelConsumptionL100km: 7.9, kerbWeightKg: 1420 },
    newPriceCents: 4_490_000, features: ["Sports seats"],
  },
  brindleDiesel: {
    make: "Lumbrey", model: "Brindle", variant: "Diesel AWD", wmi: "Z9L", vds: "BR2W5", plant: "M",
    spec: dieselWagon, newPriceCents: 4_790_000, features: ["Roof rails", "Cargo cover"],
  },
  brindlePetrol: {
    make: "Lumbrey", model: "Brindle", variant: "Turbo", wmi: "Z9L", vds: "BR3W5", plant: "M",
    spec: { ...dieselWagon, fuelType: "petrol", engineCapacityCc: 1984, powerKw: 162, torqueNm: 350, fuelConsumptionL100km: 8.1, consumptionTestCycle: "wltp", fuelTankLitres: 66, kerbWeightKg: 1580 },
    newPriceCents: 5_290_000, features: ["Roof rails", "Cargo cover", "Power tailgate"],
  },
} satisfies Record<string, Line>;
type LineId = keyof typeof LINES;

/** Plain feature words of our own; no trade names. */
const FEATURE_POOL = [
  "Reversing camera", "Cruise control", "Adaptive cruise control", "Rear parking sensors", "Front parking sensors",
  "Phone mirroring", "Hands-free calling", "Digital radio", "Satellite navigation", "Keyless entry", "Push-button start",
  "Dual-zone climate control", "Heated front seats", "Auto headlights", "Rain-sensing wipers", "Blind-spot monitoring",
  "Lane keeping assist", "Autonomous emergency braking", "Tinted rear windows", "USB-C ports", "Wireless phone charger",
  "Electric folding mirrors", "Child seat anchors", "Full-size spare wheel", "LED headlights",
];

/** Invented workshops in and around the invented town of Tallowbridge. */
const WORKSHOPS = [
  "Tallowbridge Auto Care", "Quarry Lane Workshop", "Eastern Downs Mechanical", "Kettleford Service Centre", "Millrace Motor Repairs",
];
const TYRE_SHOP = "Tallowbridge Tyre Bay";
const OUR_WORKSHOP = "Fernhollow Motors workshop";

interface Extra {
  /** Gap counted from the end of the owner's scheduled services: 1 = between the last two, 0 = after the last. */
  gap: number;
  kind: ServiceKind;
  notes: string;
  workshop?: string;
}

interface Plan {
  line: LineId;
  /** Months from first registration to today. */
  ageMonths: number;
  kmPerYear: number;
  colour: string;
  status: VehicleStatus;
  stockedDaysAgo: number;
  previousOwners: number;
  keysCount: number;
  /** At most this many of the previous owners' service entries are recorded (0: none came with it). */
  history: number;
  extras?: Extra[];
  /** The previous owners stopped servicing this many months before we stocked it. */
  gapMonths?: number;
  noVin?: boolean;
  /** Deliberately wrong VIN check digit (a mis-stamped or misread plate): flagged, never refused, outside North America. */
  badCheckDigit?: boolean;
  /** One service entry records a lower odometer than the entry before it. */
  odometerDecrease?: boolean;
  /** Fields not yet filled in: staff complete a record in stages. */
  omit?: Field[];
  /** An honest condition paragraph for the listing copy. */
  note: string;
}

const TYRES: Extra = { gap: 1, kind: "tyres", notes: "Four new tyres, wheel alignment and balance.", workshop: TYRE_SHOP };
const BRAKES: Extra = { gap: 2, kind: "repair", notes: "Front brake pads and discs replaced." };

const PLANS: Plan[] = [
  // intake (4): incomplete by design
  { line: "pimletBase", ageMonths: 62, kmPerYear: 11_000, colour: "White", status: "intake", stockedDaysAgo: 2, previousOwners: 1, keysCount: 2, history: 0,
    noVin: true, omit: ["priceCents", "description", "powerKw", "torqueNm", "fuelTankLitres", "fuelConsumptionL100km", "consumptionTestCycle", "kerbWeightKg", "features"],
    note: "" },
  { line: "yardhandDual", ageMonths: 118, kmPerYear: 24_000, colour: "White", status: "intake", stockedDaysAgo: 1, previousOwners: 3, keysCount: 1, history: 3,
    omit: ["priceCents", "description", "kerbWeightKg"], note: "" },
  { line: "brackleHybrid", ageMonths: 40, kmPerYear: 13_000, colour: "Grey", status: "intake", stockedDaysAgo: 3, previousOwners: 1, keysCount: 2, history: 0,
    noVin: true,
    omit: ["priceCents", "description", "features", "doors", "seats", "engineCapacityCc", "cylinders", "aspiration", "powerKw", "torqueNm", "transmission", "gears", "fuelTankLitres", "fuelConsumptionL100km", "consumptionTestCycle", "kerbWeightKg", "registrationPlate"],
    note: "" },
  // Bad check digit 1 of 3: typed in from a worn plate at intake.
  { line: "sorrelSedan", ageMonths: 150, kmPerYear: 9_500, colour: "Silver", status: "intake", stockedDaysAgo: 4, previousOwners: 4, keysCount: 1, history: 5,
    badCheckDigit: true, omit: ["priceCents", "description"], note: "" },

  // preparing (6)
  { line: "loamField", ageMonths: 52, kmPerYear: 19_000, colour: "Dark blue", status: "preparing", stockedDaysAgo: 9, previousOwners: 1, keysCount: 2, history: 4,
    extras: [{ gap: 2, kind: "recall", notes: "Recall campaign: fuel injector harness inspected and re-secured.", workshop: "Ambrel Service Tallowbridge" }],
    omit: ["description"], note: "" },
  { line: "dappleHatch", ageMonths: 74, kmPerYear: 14_000, colour: "Red", status: "preparing", stockedDaysAgo: 12, previousOwners: 2, keysCount: 2, history: 6,
    extras: [TYRES], omit: ["description"], note: "" },
  // The odometer-decrease case: an ex-fleet van whose service book has one reading lower than the one before.
  { line: "cartwayVan", ageMonths: 96, kmPerYear: 23_000, colour: "White", status: "preparing", stockedDaysAgo: 15, previousOwners: 2, keysCount: 2, history: 7,
    odometerDecrease: true, extras: [TYRES, BRAKES],
    note: "Ex-fleet van. The load area has scuffs and a few dents in the side panels from loading; the floor mat is worn through near the rear doors. The service book has one reading lower than the one before it, which we are checking with the workshop that stamped it." },
  { line: "ohmra64", ageMonths: 36, kmPerYear: 12_000, colour: "Blue", status: "preparing", stockedDaysAgo: 6, previousOwners: 1, keysCount: 2, history: 2,
    omit: ["priceCents"], note: "The battery health report from our charger reads 96 %. One alloy wheel has kerb marks." },
  // Bad check digit 2 of 3: the VIN plate and the registration papers agree, but the check digit does not compute.
  { line: "brindleDiesel", ageMonths: 110, kmPerYear: 16_000, colour: "Green", status: "preparing", stockedDaysAgo: 20, previousOwners: 2, keysCount: 1, history: 7,
    badCheckDigit: true, extras: [TYRES, { gap: 3, kind: "repair", notes: "Replaced the water pump and thermostat." }],
    note: "Only one key. The driver's seat bolster shows wear and there is a small stone chip in the windscreen, outside the driver's view." },
  { line: "pimletSport", ageMonths: 28, kmPerYear: 9_000, colour: "Yellow", status: "preparing", stockedDaysAgo: 8, previousOwners: 1, keysCount: 2, history: 2,
    omit: ["description"], note: "" },

  // live (10)
  { line: "loamField", ageMonths: 64, kmPerYear: 17_500, colour: "White", status: "live", stockedDaysAgo: 34, previousOwners: 1, keysCount: 2, history: 5,
    extras: [TYRES, { gap: 3, kind: "recall", notes: "Recall campaign: fuel injector harness inspected and re-secured.", workshop: "Ambrel Service Tallowbridge" }],
    note: "One owner and serviced on time. The third-row seats have hardly been used. There are light scratches on the rear bumper where things have been loaded." },
  { line: "loamCrest", ageMonths: 30, kmPerYear: 21_000, colour: "Black", status: "live", stockedDaysAgo: 22, previousOwners: 1, keysCount: 2, history: 2,
    note: "Mostly highway kilometres. The paint has fine swirl marks that show in direct sun; the interior is clean." },
  { line: "yardhandDualManual", ageMonths: 84, kmPerYear: 22_000, colour: "Silver", status: "live", stockedDaysAgo: 45, previousOwners: 2, keysCount: 2, history: 6,
    extras: [TYRES, { gap: 2, kind: "repair", notes: "Clutch and flywheel replaced." }],
    note: "A working ute. The tub liner has scratches, there is a dent in the tailgate and the tow bar has been used. The clutch was replaced two services ago." },
  // The overdue case: the last service was more than two years before we stocked it.
  { line: "yardhandCab", ageMonths: 140, kmPerYear: 18_000, colour: "White", status: "live", stockedDaysAgo: 61, previousOwners: 3, keysCount: 1, history: 5,
    gapMonths: 30, extras: [{ gap: 0, kind: "tyres", notes: "Two new rear tyres.", workshop: TYRE_SHOP }],
    note: "The last logbook service was more than two years ago, so it is due for one now; we have priced that in. The tray has surface rust on the headboard." },
  { line: "ohmra77", ageMonths: 20, kmPerYear: 15_000, colour: "Grey", status: "live", stockedDaysAgo: 18, previousOwners: 1, keysCount: 2, history: 1,
    extras: [{ gap: 0, kind: "recall", notes: "Software campaign: charge-port lock update.", workshop: "Vantrel Service Tallowbridge" }],
    note: "The battery health report from our charger reads 98 %. Both charging cables are included." },
  { line: "sparrel", ageMonths: 44, kmPerYear: 14_000, colour: "Silver", status: "live", stockedDaysAgo: 27, previousOwners: 1, keysCount: 2, history: 3,
    note: "Charged at home most nights by its owner, so the petrol engine has done less work than the odometer suggests. Small scrape under the front bumper." },
  { line: "sorrelSedan", ageMonths: 100, kmPerYear: 12_000, colour: "Bronze", status: "live", stockedDaysAgo: 52, previousOwners: 2, keysCount: 2, history: 7,
    extras: [BRAKES],
    note: "A quiet, comfortable sedan. The clear coat on the roof is starting to fade and the rear seat has a small burn mark." },
  { line: "sorrelCoupe", ageMonths: 160, kmPerYear: 8_000, colour: "Red", status: "live", stockedDaysAgo: 88, previousOwners: 3, keysCount: 2, history: 6,
    extras: [{ gap: 1, kind: "repair", notes: "Replaced the front lower control arm bushes." }],
    note: "Low kilometres for its age and kept in a garage. The driver's seat leather-look trim is cracked on the outer bolster." },
  { line: "dappleSedan", ageMonths: 58, kmPerYear: 16_000, colour: "White", status: "live", stockedDaysAgo: 14, previousOwners: 1, keysCount: 2, history: 4,
    extras: [TYRES],
    note: "Ex-rideshare car with one owner. The rear seats show wear and the boot floor has a stain." },
  { line: "cartwayCrew", ageMonths: 70, kmPerYear: 20_000, colour: "Grey", status: "live", stockedDaysAgo: 39, previousOwners: 1, keysCount: 2, history: 5,
    extras: [{ gap: 2, kind: "inspection", notes: "Annual passenger vehicle inspection passed." }],
    note: "Used by a school for sports trips. The third-row seat fabric has marks that did not come out with cleaning." },

  // reserved (3)
  { line: "brackleAwd", ageMonths: 48, kmPerYear: 13_500, colour: "Blue", status: "reserved", stockedDaysAgo: 30, previousOwners: 1, keysCount: 2, history: 3,
    note: "One owner. A small dent in the rear passenger door has been repaired; the paint match is close but visible up close." },
  // Bad check digit 3 of 3: an old hatch whose compliance plate was replaced after a repair.
  { line: "pimletBase", ageMonths: 170, kmPerYear: 10_500, colour: "Silver", status: "reserved", stockedDaysAgo: 41, previousOwners: 4, keysCount: 1, history: 6,
    badCheckDigit: true, extras: [TYRES, { gap: 3, kind: "repair", notes: "Replaced the timing chain and tensioner." }],
    note: "An older, simple car at a low price. It has one key, faded paint on the bonnet and a replacement compliance plate; the VIN check digit does not compute, so we have asked the registry to confirm the number." },
  { line: "brindlePetrol", ageMonths: 66, kmPerYear: 15_000, colour: "Grey", status: "reserved", stockedDaysAgo: 25, previousOwners: 2, keysCount: 2, history: 5,
    note: "The dual-clutch gearbox was serviced on schedule. There is a scratch along the rear bumper." },

  // sold (3)
  { line: "loamField", ageMonths: 26, kmPerYear: 18_000, colour: "Silver", status: "sold", stockedDaysAgo: 95, previousOwners: 1, keysCount: 2, history: 2,
    note: "One owner and still inside its original warranty when it came to us. Clean inside." },
  { line: "ohmra77", ageMonths: 6, kmPerYear: 12_000, colour: "White", status: "sold", stockedDaysAgo: 72, previousOwners: 0, keysCount: 2, history: 0,
    note: "Our own demonstrator, driven by staff only. No marks we could find." },
  { line: "dappleHatch", ageMonths: 132, kmPerYear: 13_000, colour: "Green", status: "sold", stockedDaysAgo: 110, previousOwners: 3, keysCount: 1, history: 8,
    extras: [TYRES, { gap: 4, kind: "repair", notes: "Replaced the 12 V battery and the inverter coolant pump." }],
    note: "An older hybrid with a full service book. The hybrid battery was tested and is within the maker's limits." },

  // archived (2)
  { line: "sorrelSedan", ageMonths: 176, kmPerYear: 14_000, colour: "White", status: "archived", stockedDaysAgo: 118, previousOwners: 4, keysCount: 1, history: 4,
    note: "Sold to the trade: high kilometres, hail marks on the roof and bonnet." },
  { line: "cartwayVan", ageMonths: 150, kmPerYear: 25_000, colour: "White", status: "archived", stockedDaysAgo: 104, previousOwners: 3, keysCount: 1, history: 6,
    extras: [TYRES, { gap: 2, kind: "repair", notes: "Replaced the clutch and dual-mass flywheel." }],
    note: "Sold to the trade. It runs, but the gearbox whines in fifth and sixth." },

  // withdrawn (2)
  { line: "sparrel", ageMonths: 60, kmPerYear: 11_000, colour: "Black", status: "withdrawn", stockedDaysAgo: 57, previousOwners: 1, keysCount: 2, history: 4,
    extras: [{ gap: 2, kind: "recall", notes: "Recall campaign: high-voltage cable clamp replaced.", workshop: "Vantrel Service Tallowbridge" }],
    note: "Taken back by its owner before sale." },
  { line: "yardhandDual", ageMonths: 36, kmPerYear: 25_000, colour: "Orange", status: "withdrawn", stockedDaysAgo: 66, previousOwners: 1, keysCount: 2, history: 3,
    note: "Withdrawn while a finance company confirms it holds no interest in the vehicle." },
];

const MONTHS = ["January", "February", "March", "April", "May", "June", "July", "August", "September", "October", "November", "December"];
/** Plate letters leave out vowels and a few consonants so that no plate spells a word or an abbreviation. */
const PLATE_LETTERS = "CDFHJKLMNPRSTWXZ";

const grouped = (n: number) => String(Math.round(n)).replace(/\B(?=(\d{3})+(?!\d))/g, ",");
const addDays = (date: CalendarDate, days: number) => fromDayNumber(dayNumber(date) + days);
const iso = formatIsoDate;

function modelYearCode(year: number): string {
  const code = Object.keys(MODEL_YEAR_CODES).find((c) => (year - MODEL_YEAR_CODES[c]) % 30 === 0);
  if (!code) throw new Error(`No model-year code for ${year}.`);
  return code;
}

function makeVin(faker: Faker, line: Line, buildYear: number, bad: boolean): string {
  // Position 7 is a letter for model years 2010 on and a digit before (TRADE.md §1.3 tie-break).
  const vds = buildYear >= 2010 ? line.vds : line.vds.slice(0, 3) + "7" + line.vds.slice(4);
  const serial = faker.string.numeric({ length: 6, allowLeadingZeros: true });
  const draft = `${line.wmi}${vds}?${modelYearCode(buildYear)}${line.plant}${serial}`;
  const right = computeCheckDigit(draft)!;
  const digit = bad ? (right === "X" ? "7" : String((Number(right) + 3) % 10)) : right;
  return draft.replace("?", digit);
}

function makePlate(faker: Faker): string {
  return `${faker.string.fromCharacters(PLATE_LETTERS, 3)} ${faker.string.numeric({ length: 2, allowLeadingZeros: false })}${faker.string.fromCharacters(PLATE_LETTERS, 1)}`;
}

function priceCents(line: Line, ageYears: number, odometerKm: number): number {
  const expectedKm = 15_000 * ageYears;
  const kmFactor = Math.min(1.08, Math.max(0.8, 1 - (odometerKm - expectedKm) / 400_000));
  const dollars = (line.newPriceCents / 100) * 0.88 * Math.pow(0.89, ageYears) * kmFactor;
  // Dealers price to the $..990; never below the yard's floor of $8,990.
  return Math.max(8_990, Math.round(dollars / 500) * 500 - 10) * 100;
}

function serviceHistory(
  faker: Faker,
  plan: Plan,
  reg: CalendarDate,
  stock: CalendarDate,
  today: CalendarDate,
  odometerAtStockKm: number,
  odometerKm: number,
): ServiceEntryInput[] {
  const regDay = dayNumber(reg);
  const stockDay = dayNumber(stock);
  const ownerEnd = dayNumber(addMonths(addDays(stock, -10), -(plan.gapMonths ?? 0)));
  const kmAt = (day: number) => Math.round(odometerAtStockKm * ((day - regDay) / (stockDay - regDay)));
  const workshop = faker.helpers.arrayElement(WORKSHOPS);
  const line: Line = LINES[plan.line];

  // The previous owners' scheduled services: about every 12 months, the reading rising with the date.
  const rows: Array<{ day: number; km: number; kind: ServiceKind; workshop: string; notes: string }> = [];
  for (let months = 12; ; months += 12) {
    const day = dayNumber(addMonths(reg, months)) + faker.number.int({ min: -20, max: 20 });
    if (day > ownerEnd) break;
    const km = Math.round(kmAt(day) * faker.number.float({ min: 0.97, max: 1, fractionDigits: 3 }));
    rows.push({ day, km, kind: "scheduled", workshop, notes: `Scheduled ${months / 12 === 1 ? "first-year" : `${months / 12}-year`} service: oil, filters, brake and fluid checks.` });
  }
  if (line.spec.fuelType === "electric") for (const r of rows) r.notes = "Scheduled service: cabin filter, brake fluid, tyre rotation.";

  // Other work between scheduled services, at the midpoint of the gap in date and reading.
  const extras: typeof rows = [];
  for (const extra of plan.extras ?? []) {
    const after = rows[rows.length - 1 - extra.gap];
    if (!after) continue;
    const before = extra.gap === 0 ? { day: ownerEnd, km: Math.max(after.km, kmAt(ownerEnd)) } : rows[rows.length - extra.gap];
    const day = Math.floor((after.day + before.day) / 2);
    if (day <= after.day || day >= before.day) continue;
    extras.push({ day, km: Math.round((after.km + before.km) / 2), kind: extra.kind, workshop: extra.workshop ?? workshop, notes: extra.notes });
  }
  const owner = [...rows, ...extras].sort((a, b) => a.day - b.day);

  // Our own work once the vehicle is past intake: a pre-sale inspection, and a service when the last one is getting
  // old (more than 10 months or 12,000 km back). The overdue case is left unserviced on purpose.
  const ours: typeof rows = [];
  const ourDay = stockDay + 2;
  if (plan.status !== "intake" && ourDay <= dayNumber(today)) {
    const km = Math.min(odometerKm, odometerAtStockKm + 3);
    const lastService = rows.at(-1);
    const due = !lastService || stockDay - lastService.day > 304 || odometerAtStockKm - lastService.km > 12_000;
    if (due && plan.gapMonths === undefined && rows.length > 0) {
      ours.push({ day: ourDay, km, kind: "scheduled", workshop: OUR_WORKSHOP, notes: "Service before sale: oil, filters, brake and fluid checks, with a pre-sale inspection and road test." });
    } else {
      ours.push({ day: ourDay, km, kind: "inspection", workshop: OUR_WORKSHOP, notes: "Pre-sale inspection: brakes, tyres, fluids, lights and a road test." });
    }
  }
  const kept = plan.history > 0 ? owner.slice(-Math.min(plan.history, 8 - ours.length)) : [];

  if (plan.odometerDecrease && kept.length >= 3) {
    // A misread digit in one stamp: the reading falls below the entry before it, then recovers.
    const k = kept.length - 2;
    const previous = kept[k - 1].km;
    const original = kept[k].km;
    kept[k].km = original - 10_000 * Math.ceil((original - previous + 1) / 10_000);
  }
  return [...kept, ...ours].map((r) => ({ date: iso(fromDayNumber(r.day)), odometerKm: r.km, kind: r.kind, workshop: r.workshop, notes: r.notes }));
}

function engineSummary(spec: Spec): string {
  const litres = spec.engineCapacityCc ? `${(spec.engineCapacityCc / 1000).toFixed(1)} L` : "";
  const turbo = spec.aspiration === "turbo" ? "turbo " : "";
  switch (spec.fuelType) {
    case "electric":
      return `Electric, with a ${spec.batteryKwh} kWh battery, ${spec.powerKw} kW and ${spec.torqueNm} N·m`;
    case "plug_in_hybrid":
      return `${litres} ${turbo}petrol plug-in hybrid with an ${spec.batteryKwh} kWh battery, ${spec.powerKw} kW combined`;
    case "hybrid":
      return `${litres} petrol-electric hybrid, ${spec.powerKw} kW combined`;
    case "diesel":
      return `${litres} ${spec.cylinders}-cylinder ${turbo}diesel, ${spec.powerKw} kW and ${spec.torqueNm} N·m`;
    default:
      return `${litres} ${spec.cylinders}-cylinder ${turbo}petrol, ${spec.powerKw} kW and ${spec.torqueNm} N·m`;
  }
}

function gearboxSummary(spec: Spec): string {
  switch (spec.transmission) {
    case "manual": return `${spec.gears}-speed manual`;
    case "cvt": return "CVT automatic";
    case "dual_clutch": return `${spec.gears}-speed dual-clutch automatic`;
    default: return spec.gears === 1 ? "single-speed automatic" : `${spec.gears}-speed automatic`;
  }
}

function listingCopy(plan: Plan, line: Line, buildYear: number, odometerKm: number, history: ServiceEntryInput[], features: string[]): string {
  const spec = line.spec;
  const drive = spec.driveType ? LABELS.driveType[spec.driveType].toLowerCase() : "";
  const paragraphs = [
    `${buildYear} ${line.make} ${line.model} ${line.variant}: ${engineSummary(spec)}, ${gearboxSummary(spec)}, ${drive}. ${spec.seats} seats and ${grouped(odometerKm)} km on the odometer.`,
  ];
  const scheduled = history.filter((e) => e.kind === "scheduled");
  const last = scheduled.at(-1);
  if (last) {
    const d = parseIsoDate(last.date)!;
    paragraphs.push(`The service book has ${history.length} ${history.length === 1 ? "entry" : "entries"}; the last scheduled service was at ${grouped(last.odometerKm)} km in ${MONTHS[d.month - 1]} ${d.year}.`);
  } else {
    paragraphs.push(history.length > 0 ? "No scheduled service is recorded yet; we inspected it before listing." : "No service book came with it.");
  }
  if (plan.note) paragraphs.push(plan.note);
  const owners = plan.previousOwners === 0 ? "No previous owners" : `${plan.previousOwners} previous ${plan.previousOwners === 1 ? "owner" : "owners"}`;
  const keys = `${plan.keysCount} ${plan.keysCount === 1 ? "key" : "keys"}`;
  paragraphs.push([`- ${owners}`, `- ${keys}`, ...features.slice(0, 4).map((f) => `- ${f}`)].join("\n"));
  return paragraphs.join("\n\n");
}

function buildVehicle(plan: Plan, index: number, today: CalendarDate): DemoVehicle {
  const faker = new Faker({ locale: [en] });
  // One seed per vehicle, so a vehicle's plate and VIN do not shift when another vehicle's history changes length.
  faker.seed(4821 + index * 7919);
  const line: Line = LINES[plan.line];

  const plate = makePlate(faker);
  const reg = addDays(addMonths(today, -plan.ageMonths), -faker.number.int({ min: 0, max: 25 }));
  const buildYear = reg.year;
  const vin = makeVin(faker, line, buildYear, plan.badCheckDigit ?? false);
  const stock = addDays(today, -plan.stockedDaysAgo);

  const ownedDays = dayNumber(stock) - dayNumber(reg);
  const odometerAtStockKm = Math.round((plan.kmPerYear * ownedDays) / 365.25 * faker.number.float({ min: 0.94, max: 1.06, fractionDigits: 3 }));
  const dealerKm = plan.stockedDaysAgo >= 3 ? faker.number.int({ min: 5, max: 60 }) : 0;
  const odometerKm = odometerAtStockKm + dealerKm;
  const history = serviceHistory(faker, plan, reg, stock, today, odometerAtStockKm, odometerKm);

  const features = [...new Map([...line.features, ...faker.helpers.arrayElements(FEATURE_POOL, { min: 3, max: 7 })].map((f) => [f.toLowerCase(), f])).values()];
  const ageYears = ownedDays / 365.25;

  const input: CreateVehicleInput = {
    vin: plan.noVin ? null : vin,
    registrationPlate: plate,
    make: line.make,
    model: line.model,
    variant: line.variant,
    buildYear,
    firstRegistrationDate: iso(reg),
    colour: plan.colour,
    ...line.spec,
    odometerKm,
    keysCount: plan.keysCount,
    previousOwners: plan.previousOwners,
    features,
    priceCents: priceCents(line, ageYears, odometerKm),
    description: listingCopy(plan, line, buildYear, odometerKm, history, features),
    serviceHistory: history,
  };
  for (const field of plan.omit ?? []) delete input[field];
  return { input, status: plan.status, stockedDaysAgo: plan.stockedDaysAgo };
}

/** The 30 demo vehicles as of `today` (YYYY-MM-DD); the same date always gives the same vehicles. */
export function demoVehicles(today: string): DemoVehicle[] {
  const date = parseIsoDate(today);
  if (!date) throw new Error(`demoVehicles needs a date like 2026-12-01, not ${JSON.stringify(today)}.`);
  return PLANS.map((plan, index) => buildVehicle(plan, index, date));
}
