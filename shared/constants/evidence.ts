/** The walk-around's zones (../shared/PRODUCT.md vocabulary). Left and right as seen from the driver's seat. */
export const ZONES = [
  "front", "bonnet", "roof", "left_side", "right_side", "rear", "glass", "wheels_tyres",
  "interior_front", "interior_rear", "cargo_area", "engine_bay", "underbody",
] as const;
export type Zone = (typeof ZONES)[number];

export const ZONE_LABELS: Record<Zone, string> = {
  front: "Front", bonnet: "Bonnet", roof: "Roof", left_side: "Left side", right_side: "Right side", rear: "Rear",
  glass: "Glass", wheels_tyres: "Wheels and tyres", interior_front: "Interior, front", interior_rear: "Interior, rear",
  cargo_area: "Cargo area", engine_bay: "Engine bay", underbody: "Underbody",
};

/** The trade's usual kinds of defect (../shared/TRADE.md §9.2, common practice). */
export const DEFECT_KINDS = [
  "stone_chip", "scratch", "scuff", "dent", "kerb_rash", "crack", "corrosion", "paint_fade", "poor_repair", "glass_chip",
  "interior_wear", "stain", "tear", "burn", "missing_broken_part", "mechanical_fault", "electrical_fault",
] as const;
export type DefectKind = (typeof DEFECT_KINDS)[number];

export const DEFECT_KIND_LABELS: Record<DefectKind, string> = {
  stone_chip: "Stone chip", scratch: "Scratch", scuff: "Scuff", dent: "Dent", kerb_rash: "Kerb rash", crack: "Crack",
  corrosion: "Corrosion", paint_fade: "Paint fade", poor_repair: "Poor earlier repair", glass_chip: "Glass chip",
  interior_wear: "Interior wear", stain: "Stain", tear: "Tear", burn: "Burn", missing_broken_part: "Missing or broken part",
  mechanical_fault: "Mechanical fault", electrical_fault: "Electrical fault",
};

export const SEVERITIES = ["minor", "moderate", "major"] as const;
export type Severity = (typeof SEVERITIES)[number];
export const SEVERITY_LABELS: Record<Severity, string> = { minor: "Minor", moderate: "Moderate", major: "Major" };

export const REPAIR_PLANS = ["repaired_before_sale", "disclosed_as_is", "to_be_repaired"] as const;
export type RepairPlanCode = (typeof REPAIR_PLANS)[number];
export const REPAIR_PLAN_LABELS: Record<RepairPlanCode, string> = {
  repaired_before_sale: "Repaired before sale",
  disclosed_as_is: "Disclosed as is",
  to_be_repaired: "To be repaired",
};

export const TYRE_POSITIONS = ["front_left", "front_right", "rear_left", "rear_right", "spare"] as const;
export type TyrePosition = (typeof TYRE_POSITIONS)[number];
export const TYRE_POSITION_LABELS: Record<TyrePosition, string> = {
  front_left: "Front left", front_right: "Front right", rear_left: "Rear left", rear_right: "Rear right", spare: "Spare",
};

/** Function and safety checks. Safety items (a failure blocks publishing) match shared/domain/condition-rules.ts. */
export const CHECK_ITEMS = [
  "brakes", "lights", "glass", "wipers_washers", "warning_lamps", "climate", "windows", "seat_belts", "keys", "books", "spare_tools",
] as const;
export type CheckItem = (typeof CHECK_ITEMS)[number];
export const CHECK_LABELS: Record<CheckItem, string> = {
  brakes: "Brakes", lights: "Lights", glass: "Glass", wipers_washers: "Wipers and washers", warning_lamps: "Warning lamps",
  climate: "Heating and air conditioning", windows: "Windows", seat_belts: "Seat belts", keys: "Keys", books: "Books and manuals",
  spare_tools: "Spare wheel and tools",
};
export const CHECK_RESULTS = ["pass", "advise", "fail"] as const;
export type CheckResultCode = (typeof CHECK_RESULTS)[number];
export const CHECK_RESULT_LABELS: Record<CheckResultCode, string> = { pass: "Pass", advise: "Advise", fail: "Fail" };

/** Upload limits, in one place: the server enforces them and the upload screen states them. */
export const PHOTO_LIMITS = {
  maxFileBytes: 25 * 1024 * 1024,
  maxFilesPerUpload: 20,
  maxPhotosPerVehicle: 60,
  maxInputPixels: 50_000_000,
  minShortSidePx: 320,
} as const;

/** Widths of the served variants; the largest is capped at the original's width. */
export const PHOTO_WIDTHS = [320, 640, 1024, 1600] as const;
export const PHOTO_FORMATS = ["avif", "webp", "jpeg"] as const;
export type PhotoFormat = (typeof PHOTO_FORMATS)[number];
