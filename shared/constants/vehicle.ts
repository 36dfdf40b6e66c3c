import { FUEL_TYPES } from "../domain/fuel.ts";
import { SERVICE_KINDS } from "../domain/service.ts";

export { FUEL_TYPES, SERVICE_KINDS };
export const DRIVE_TYPES = ["fwd", "rwd", "awd", "4wd"] as const;
export const ASPIRATIONS = ["natural", "turbo", "supercharged"] as const;
export const TRANSMISSIONS = ["manual", "automatic", "cvt", "dual_clutch"] as const;
export const BODY_TYPES = ["hatchback", "sedan", "wagon", "suv", "ute", "van", "coupe", "convertible", "people_mover", "cab_chassis"] as const;
export const TEST_CYCLES = ["wltp", "nedc", "epa", "measured"] as const;
export const DISTANCE_UNITS_ENTERED = ["km", "mi"] as const;

export const VEHICLE_STATUSES = ["intake", "preparing", "live", "reserved", "sold", "archived", "withdrawn"] as const;
export type VehicleStatus = (typeof VEHICLE_STATUSES)[number];

export const LABELS = {
  fuelType: { petrol: "Petrol", diesel: "Diesel", hybrid: "Hybrid", plug_in_hybrid: "Plug-in hybrid", electric: "Electric", lpg: "LPG" },
  driveType: { fwd: "Front-wheel drive", rwd: "Rear-wheel drive", awd: "All-wheel drive", "4wd": "Four-wheel drive" },
  aspiration: { natural: "Naturally aspirated", turbo: "Turbocharged", supercharged: "Supercharged" },
  transmission: { manual: "Manual", automatic: "Automatic", cvt: "CVT", dual_clutch: "Dual-clutch" },
  bodyType: {
    hatchback: "Hatchback", sedan: "Sedan", wagon: "Wagon", suv: "SUV", ute: "Ute / pickup", van: "Van", coupe: "Coupe",
    convertible: "Convertible", people_mover: "People mover", cab_chassis: "Cab chassis",
  },
  consumptionTestCycle: { wltp: "WLTP combined", nedc: "NEDC combined", epa: "EPA combined", measured: "Measured by us" },
  status: {
    intake: "Intake", preparing: "Preparing", live: "Live", reserved: "Reserved", sold: "Sold", archived: "Archived", withdrawn: "Withdrawn",
  },
  serviceKind: {
    scheduled: "Scheduled service", intermediate: "Intermediate (oil and filter)", repair: "Repair", recall: "Recall or campaign",
    inspection: "Inspection", tyres: "Tyres", other: "Other",
  },
} as const;
