// The tyres-and-checks form as the person typed it (strings, so nothing typed is lost), and the request bodies,
// live readings and field-error keys made from it. Validation is the server's own schema (shared/schemas/evidence.ts).
import { checksSchema, tyresSchema, type ChecksInput, type TyresInput } from "../../../shared/schemas/evidence.ts";
import { zodFields } from "../../../shared/schemas/fields.ts";
import { CHECK_ITEMS, CHECK_LABELS, TYRE_POSITION_LABELS, TYRE_POSITIONS, type CheckItem, type CheckResultCode, type TyrePosition } from "../../../shared/constants/evidence.ts";
import { assessTyre, type TyreAssessment, type TyreReading } from "../../../shared/domain/tyre-assessment.ts";
import { safetyCautions, type Caution } from "../../../shared/domain/cautions.ts";
import { formatNumber } from "../../../shared/domain/display.ts";
import type { ChecksSetView, TyresView } from "./api/checks.ts";

export const TREAD_FIELDS = ["treadInnerMm", "treadCentreMm", "treadOuterMm"] as const;
export const TYRE_FIELDS = [...TREAD_FIELDS, "sizeDesignation", "dotCode", "pressureKpa"] as const;
export type TyreField = (typeof TYRE_FIELDS)[number];
export const TREAD_LABELS: Record<(typeof TREAD_FIELDS)[number], string> = { treadInnerMm: "Inner", treadCentreMm: "Centre", treadOuterMm: "Outer" };
export type TyreForm = Record<TyreField, string>;

export interface TyresForm {
  measuredOn: string;
  /** False: "No spare / not measured"; the spare's values stay in the form but are not sent. */
  spare: boolean;
  tyres: Record<TyrePosition, TyreForm>;
}

export interface CheckForm {
  result: CheckResultCode | "";
  note: string;
}
export type ChecksForm = Record<CheckItem, CheckForm>;

/** Field errors keyed for the screen: `measuredOn`, `tyre.<position>.<field>`, `check.<item>.<field>`, `tyres._`, `checks._`. */
export type FieldErrors = Record<string, string>;

const text = (n: number | string | null | undefined) => (n == null ? "" : String(n));
const emptyTyre = (): TyreForm => ({ treadInnerMm: "", treadCentreMm: "", treadOuterMm: "", sizeDesignation: "", dotCode: "", pressureKpa: "" });

export function tyresFormFrom(view: TyresView, today: string): TyresForm {
  const tyres = Object.fromEntries(TYRE_POSITIONS.map((p) => [p, emptyTyre()])) as Record<TyrePosition, TyreForm>;
  for (const { reading } of view.readings) {
    const p = reading.position;
    if (!tyres[p]) continue;
    // Tread is recorded to 1 dp (TRADE.md §2.5), so a stored 5 reads back as it was typed, "5.0".
    tyres[p] = Object.fromEntries(
      TYRE_FIELDS.map((f) => [f, (TREAD_FIELDS as readonly string[]).includes(f) ? (formatNumber(reading[f] as number | null, { fractionDigits: 1 }) ?? "") : text(reading[f])]),
    ) as TyreForm;
  }
  return { measuredOn: view.measuredOn ?? today, spare: view.readings.some((r) => r.reading.position === "spare"), tyres };
}

export function checksFormFrom(view: ChecksSetView): ChecksForm {
  return Object.fromEntries(
    CHECK_ITEMS.map((item) => {
      const r = view.results.find((x) => x.item === item);
      return [item, { result: r?.result ?? "", note: r?.note ?? "" }];
    }),
  ) as ChecksForm;
}

/**
 * A typed number for the body: empty → null, "4,9" or "4.9" → 4.9. Anything else is passed on as typed, so the
 * shared schema answers with its own message ("… must be a number of millimetres.").
 */
export function numberFrom(value: string): number | null | string {
  const v = value.trim().replace(",", ".");
  if (v === "") return null;
  return /^(\d+(\.\d*)?|\.\d+)$/.test(v) ? Number(v) : value;
}
const liveNumber = (value: string) => {
  const n = numberFrom(value);
  return typeof n === "number" ? n : null;
};

export const tyreHasValue = (t: TyreForm) => TYRE_FIELDS.some((f) => t[f].trim() !== "");

/** Positions that will be sent: each with at least one value; the spare only when it is being measured. */
export const sentPositions = (form: TyresForm) => TYRE_POSITIONS.filter((p) => (p !== "spare" || form.spare) && tyreHasValue(form.tyres[p]));

/** One tyre as a reading, its figures read by `figure`: as typed for the body, numbers only for the live figures. */
function readingOf<N>(position: TyrePosition, t: TyreForm, figure: (value: string) => N) {
  return {
    position,
    treadInnerMm: figure(t.treadInnerMm),
    treadCentreMm: figure(t.treadCentreMm),
    treadOuterMm: figure(t.treadOuterMm),
    sizeDesignation: t.sizeDesignation.trim() || null,
    dotCode: t.dotCode.trim() || null,
    pressureKpa: figure(t.pressureKpa),
  };
}

export function tyresBody(form: TyresForm, version: number) {
  const positions = sentPositions(form);
  return { positions, body: { version, measuredOn: form.measuredOn, readings: positions.map((p) => readingOf(p, form.tyres[p], numberFrom)) } };
}

export function checksBody(form: ChecksForm, version: number) {
  const items = CHECK_ITEMS.filter((i) => form[i].result !== "");
  return { items, body: { version, results: items.map((item) => ({ item, result: form[item].result as CheckResultCode, note: form[item].note.trim() })) } };
}

/** Changed against what was saved: the readings as numbers (so "4.90" is "4.9"), and the date only when there are readings. */
export function tyresDirty(form: TyresForm, base: TyresForm) {
  const a = tyresBody(form, 0).body;
  const b = tyresBody(base, 0).body;
  if (JSON.stringify(a.readings) !== JSON.stringify(b.readings)) return true;
  return a.readings.length > 0 && a.measuredOn !== b.measuredOn;
}
export const checksDirty = (form: ChecksForm, base: ChecksForm) => JSON.stringify(checksBody(form, 0).body) !== JSON.stringify(checksBody(base, 0).body);

/** Server or schema `fields` (`readings.0.dotCode`) to the screen's keys (`tyre.rear_left.dotCode`). */
export function tyreErrorKeys(fields: Record<string, string>, positions: readonly TyrePosition[]): FieldErrors {
  const out: FieldErrors = {};
  for (const [key, message] of Object.entries(fields)) {
    const m = /^readings\.(\d+)(?:\.(\w+))?/.exec(key);
    const p = m ? positions[Number(m[1])] : undefined;
    const k = key === "measuredOn" ? "measuredOn" : p ? `tyre.${p}.${m?.[2] ?? "_"}` : "tyres._";
    if (!(k in out)) out[k] = message;
  }
  return out;
}

export function checkErrorKeys(fields: Record<string, string>, items: readonly CheckItem[]): FieldErrors {
  const out: FieldErrors = {};
  for (const [key, message] of Object.entries(fields)) {
    const m = /^results\.(\d+)(?:\.(\w+))?/.exec(key);
    const item = m ? items[Number(m[1])] : undefined;
    const k = item ? `check.${item}.${m?.[2] ?? "_"}` : "checks._";
    if (!(k in out)) out[k] = message;
  }
  return out;
}

/** The shared schema first, then the one rule it leaves to the form: tread is recorded to 1 dp (TRADE.md §2.5). */
export function validateTyres(form: TyresForm, version: number, today: string): { body: TyresInput; positions: TyrePosition[]; errors: FieldErrors } {
  const { body, positions } = tyresBody(form, version);
  const parsed = tyresSchema(today).safeParse(body);
  const errors = parsed.success ? {} : tyreErrorKeys(zodFields(parsed.error), positions);
  for (const p of positions) {
    for (const f of TREAD_FIELDS) {
      const key = `tyre.${p}.${f}`;
      if (!errors[key] && /[.,]\d{2,}\s*$/.test(form.tyres[p][f])) errors[key] = `${TREAD_LABELS[f]} tread to 1 decimal place, like 4.9.`;
    }
  }
  return { body: body as TyresInput, positions, errors };
}

export function validateChecks(form: ChecksForm, version: number): { body: ChecksInput; items: CheckItem[]; errors: FieldErrors } {
  const { body, items } = checksBody(form, version);
  const parsed = checksSchema.safeParse(body);
  return { body: parsed.success ? parsed.data : body, items, errors: parsed.success ? {} : checkErrorKeys(zodFields(parsed.error), items) };
}

export interface TyreRules {
  legalMinTreadMm: number;
  newTyreTreadMm: number;
}

export const liveReading = (position: TyrePosition, t: TyreForm): TyreReading => readingOf(position, t, liveNumber);

/** The same assessment the server makes on save, from what is typed now. */
export function liveAssessment(position: TyrePosition, t: TyreForm, rules: TyreRules, measuredOn: string): TyreAssessment {
  const valid = /^\d{4}-\d{2}-\d{2}$/.test(measuredOn) ? measuredOn : "";
  return assessTyre(liveReading(position, t), { ...rules, measuredOn: valid });
}

/** The cautions the server would give for the form as typed (only what would be sent counts). */
export function liveCautions(tyres: TyresForm, checks: ChecksForm, rules: TyreRules): Caution[] {
  const assessments = sentPositions(tyres).map((p) => liveAssessment(p, tyres.tyres[p], rules, tyres.measuredOn));
  const results = checksBody(checks, 0).body.results.map((r) => ({ ...r, label: CHECK_LABELS[r.item] }));
  return safetyCautions(results, assessments, (p) => TYRE_POSITION_LABELS[p as TyrePosition] ?? p);
}
