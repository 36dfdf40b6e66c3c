import type { VehicleRecord as VehicleView } from "../api/vehicles.ts";
import { FIELDS } from "./fields.ts";

export interface ServiceRow {
  date: string;
  odometerKm: string;
  kind: string;
  workshop: string;
  notes: string;
}

/** What the person has typed, kept as typed (strings), so nothing is lost to parsing. */
export interface VehicleForm {
  values: Record<string, string>;
  features: string[];
  serviceHistory: ServiceRow[];
}

/** The listing copy has its own editor (DescriptionEditor), not a row in FIELDS, but it is a value like the others. */
const COPY = "description";

export function emptyForm(distanceUnit: "km" | "mi"): VehicleForm {
  const values = Object.fromEntries(FIELDS.map((f) => [f.name, ""]));
  values.odometerUnit = distanceUnit;
  values[COPY] = "";
  return { values, features: [], serviceHistory: [] };
}

export function formFromVehicle(v: VehicleView): VehicleForm {
  const values: Record<string, string> = {};
  for (const f of FIELDS) {
    // The record's plain fields: text, numbers and dates as ISO text (no objects).
    const raw = (v as unknown as Record<string, string | number | null | undefined>)[f.name];
    values[f.name] = raw == null ? "" : f.kind === "money" ? String(Number(raw) / 100) : String(raw);
  }
  values[COPY] = v.description ?? "";
  return {
    values,
    features: [...v.features],
    serviceHistory: v.serviceHistory.map((e) => ({ date: e.date, odometerKm: String(e.odometerKm), kind: e.kind, workshop: e.workshop ?? "", notes: e.notes ?? "" })),
  };
}

const numeric = (s: string) => {
  const t = s.trim().replace(/[,\s]/g, "");
  if (t === "") return null;
  const n = Number(t);
  // Unparseable text goes to the schema as typed, so the person sees the schema's own message.
  return Number.isFinite(n) ? n : s;
};

/** The form as API input: empty means "not recorded" (null); numbers parsed; the price in minor units. */
export function formToInput(form: VehicleForm): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const f of FIELDS) {
    const raw = form.values[f.name] ?? "";
    if (f.name === "odometerUnit") {
      out.odometerUnit = raw || "km";
      continue;
    }
    if (f.kind === "int" || f.kind === "number") out[f.name] = numeric(raw);
    else if (f.kind === "money") {
      const n = numeric(raw);
      out[f.name] = typeof n === "number" ? Math.round(n * 100) : n;
    } else out[f.name] = raw.trim() === "" ? null : raw.trim();
  }
  const copy = form.values[COPY] ?? "";
  out[COPY] = copy.trim() === "" ? null : copy.trim();
  out.features = form.features;
  out.serviceHistory = form.serviceHistory.map((r) => ({
    date: r.date,
    odometerKm: numeric(r.odometerKm) ?? r.odometerKm,
    kind: r.kind,
    workshop: r.workshop,
    notes: r.notes,
  }));
  return out;
}

/** Only the fields that differ from the saved record, so a save changes just what the person changed. */
export function changedFields(input: Record<string, unknown>, base: Record<string, unknown>): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const [k, v] of Object.entries(input)) {
    if (JSON.stringify(v ?? null) !== JSON.stringify(base[k] ?? null)) out[k] = v;
  }
  return out;
}

/** A number from the form for the live figures, or null when it is not (yet) one. */
export const liveNumber = (v: unknown) => (typeof v === "number" && Number.isFinite(v) ? v : null);
