import type { Role } from "./roles.ts";
import { can, rolesFor, type Action } from "../permissions.ts";
import { FIELD_GROUP_NAMES, VEHICLE_FIELDS, type FieldFeedColumn, type FieldGroup, type FieldSpec, type VehicleFieldName } from "./vehicle-field-catalogue.ts";

export * from "./vehicle-field-catalogue.ts";

/**
 * The vehicle editor's sections and who may change each, read from the field catalogue and the permissions table
 * (../shared/PRODUCT.md roles): admin and sales edit everything; workshop edits the odometer, service history and
 * specification but not price or copy; marketing edits the listing copy only.
 */
const ENTRIES = Object.entries(VEHICLE_FIELDS) as Array<[VehicleFieldName, FieldSpec]>;

export const VEHICLE_FIELD_NAMES = ENTRIES.map(([name]) => name);

const fieldsOf = (g: FieldGroup): readonly VehicleFieldName[] => ENTRIES.filter(([, f]) => f.group === g).map(([name]) => name);
export const FIELD_GROUPS = Object.fromEntries(FIELD_GROUP_NAMES.map((g) => [g, fieldsOf(g)])) as unknown as Record<FieldGroup, readonly VehicleFieldName[]>;

/** The permissions action that lets a role edit a group's fields. */
export const editActionOf = (group: FieldGroup) => `vehicle.${group}.edit` as const satisfies Action;

export const GROUP_EDITORS = Object.fromEntries(FIELD_GROUP_NAMES.map((g) => [g, rolesFor(editActionOf(g))])) as Record<FieldGroup, readonly Role[]>;

/** Fields stored in a vehicles column of their own name; `odometerKm` is the derived `odometer_km_index`. */
export const STORED_FIELD_NAMES = VEHICLE_FIELD_NAMES.filter((f): f is Exclude<VehicleFieldName, "odometerKm"> => f !== "odometerKm");

const specOf = new Map<string, FieldSpec>(ENTRIES);

export const fieldSpec = (field: string): FieldSpec | undefined => specOf.get(field);

export const fieldGroup = (field: string): FieldGroup | undefined => specOf.get(field)?.group;

/** The staff label of a catalogued field. */
export const fieldLabel = (field: VehicleFieldName): string => VEHICLE_FIELDS[field].label;

/** The public specification's row name for a field (its staff label when the catalogue gives none). */
export const specLabel = (field: VehicleFieldName): string => (VEHICLE_FIELDS[field] as FieldSpec).spec ?? VEHICLE_FIELDS[field].label;

/** Fields buyers see (snapshot, condition page, feeds); the rest are staff only. */
export const PUBLIC_FIELDS = VEHICLE_FIELD_NAMES.filter((f) => VEHICLE_FIELDS[f].public);
export const STAFF_ONLY_FIELDS = VEHICLE_FIELD_NAMES.filter((f) => !VEHICLE_FIELDS[f].public);

/** Public fields whose change "what changed" names in its "Specification updated" sentence, with the buyer's word, in catalogue order. */
export const CHANGE_WORDS = ENTRIES.flatMap(([name, f]) => (f.public && f.change ? [[name, f.change] as const] : []));

const feedLabels = new Map(ENTRIES.flatMap(([, f]) => (f.feed ? [[f.feed.column, f.feed.label] as const] : [])));

/** The catalogue label of a field's feed column. */
export const feedColumnLabel = (column: FieldFeedColumn): string => feedLabels.get(column)!;

/** The fields of a change that the role may not make; empty when all are allowed. */
export function forbiddenFields(role: Role, fields: string[]): string[] {
  return fields.filter((f) => {
    const g = fieldGroup(f);
    return !g || !can(role, editActionOf(g));
  });
}

export const canEditGroup = (role: Role, group: FieldGroup) => can(role, editActionOf(group));
