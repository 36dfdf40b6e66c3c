import { useState, type FormEvent } from "react";
import { createDefectSchema } from "../../../../shared/schemas/evidence.ts";
import { zodFields } from "../../../../shared/schemas/fields.ts";
import {
  DEFECT_KINDS, DEFECT_KIND_LABELS, REPAIR_PLANS, REPAIR_PLAN_LABELS, SEVERITIES, SEVERITY_LABELS, type Zone,
} from "../../../../shared/constants/evidence.ts";
import { CheckboxField, SelectField, TextField } from "../../../components/form/Field.tsx";
import { Button } from "../../../components/ui/Button.tsx";
import { Notice } from "../../../components/feedback/Notice.tsx";
import { isApiError } from "../../../lib/api-client.ts";
import type { DefectView } from "../api/walkaround.ts";

export interface DefectDraft {
  kind: string;
  severity: string;
  sizeMm: string;
  note: string;
  repairPlan: string;
  repairCost: string;
  safetyRelevant: boolean;
}

export const emptyDraft = (): DefectDraft => ({ kind: "scratch", severity: "minor", sizeMm: "", note: "", repairPlan: "disclosed_as_is", repairCost: "", safetyRelevant: false });
export const draftFrom = (d: DefectView): DefectDraft => ({
  kind: d.kind, severity: d.severity, sizeMm: d.sizeMm == null ? "" : String(d.sizeMm), note: d.note, repairPlan: d.repairPlan,
  repairCost: d.repairCostCents == null ? "" : String(d.repairCostCents / 100), safetyRelevant: d.safetyRelevant,
});

const num = (s: string) => (s.trim() === "" ? null : Number.isFinite(Number(s)) ? Number(s) : s);

export function draftToInput(draft: DefectDraft, zone: Zone, pin: { photoId: number; x: number; y: number } | null | undefined) {
  const cost = num(draft.repairCost);
  return {
    zone,
    kind: draft.kind,
    severity: draft.severity,
    sizeMm: num(draft.sizeMm),
    note: draft.note,
    repairPlan: draft.repairPlan,
    repairCostCents: typeof cost === "number" ? Math.round(cost * 100) : cost,
    safetyRelevant: draft.safetyRelevant,
    ...(pin !== undefined ? { pin } : {}),
  };
}

/** The defect's fields. The pin is placed on the photo beside the form. */
export function DefectForm({
  draft, onChange, onSubmit, busy, error, submitLabel, pinText, currency, onCancel,
}: {
  draft: DefectDraft;
  onChange: (d: DefectDraft) => void;
  onSubmit: (fieldsOk: boolean) => void;
  busy: boolean;
  error: unknown;
  submitLabel: string;
  pinText: string;
  currency: string;
  onCancel?: () => void;
}) {
  const [localErrors, setLocalErrors] = useState<Record<string, string>>({});
  const serverFields = isApiError(error) ? error.fields : {};
  const errors = { ...serverFields, ...localErrors };
  const set = (k: keyof DefectDraft) => (e: { target: { value: string } }) => onChange({ ...draft, [k]: e.target.value });

  function submit(e: FormEvent) {
    e.preventDefault();
    const check = createDefectSchema.safeParse(draftToInput(draft, "front", undefined));
    setLocalErrors(check.success ? {} : zodFields(check.error));
    onSubmit(check.success);
  }

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-4" aria-label={submitLabel}>
      {isApiError(error) && !Object.keys(serverFields).length ? <Notice tone="danger" title={error.message} /> : null}
      <div className="grid gap-4 sm:grid-cols-2">
        <SelectField label="Kind" value={draft.kind} onChange={set("kind")} error={errors.kind}>
          {DEFECT_KINDS.map((k) => <option key={k} value={k}>{DEFECT_KIND_LABELS[k]}</option>)}
        </SelectField>
        <fieldset className="flex flex-col gap-1">
          <legend className="text-sm font-bold">Severity</legend>
          <div className="grid grid-cols-3 gap-1" role="radiogroup">
            {SEVERITIES.map((s) => (
              <label key={s} className={`flex min-h-11 cursor-pointer items-center justify-center rounded-md border px-2 text-sm font-bold ${draft.severity === s ? "border-ink bg-ink text-paper" : "border-line-strong bg-paper-raised"}`}>
                <input type="radio" name="severity" value={s} className="sr-only" checked={draft.severity === s} onChange={set("severity")} />
                {SEVERITY_LABELS[s]}
              </label>
            ))}
          </div>
        </fieldset>
        <TextField label="Longest size" inputMode="numeric" value={draft.sizeMm} onChange={set("sizeMm")} error={errors.sizeMm} after={<span className="unit">mm</span>} hint="Measure with a ruler; a coin is not a size." />
        <SelectField label="Repair plan" value={draft.repairPlan} onChange={set("repairPlan")} error={errors.repairPlan}>
          {REPAIR_PLANS.map((p) => <option key={p} value={p}>{REPAIR_PLAN_LABELS[p]}</option>)}
        </SelectField>
        <TextField label="Note" value={draft.note} onChange={set("note")} error={errors.note} maxLength={1000} hint="Where exactly, and what a buyer would notice." />
        <TextField label="Internal repair cost" inputMode="decimal" value={draft.repairCost} onChange={set("repairCost")} error={errors.repairCostCents} after={<span className="unit">{currency}</span>} hint="Staff only; never shown to buyers." />
      </div>
      <CheckboxField label="Affects safety (brakes, steering, tyres, lights, glass in the driver's view, structure)" checked={draft.safetyRelevant} onChange={(e) => onChange({ ...draft, safetyRelevant: e.target.checked })} />
      <p className="text-sm text-ink-soft">{pinText}</p>
      {errors["pin.photoId"] || errors["pin.x"] ? <p className="text-sm font-bold text-brick">{errors["pin.photoId"] ?? errors["pin.x"]}</p> : null}
      <div className="flex gap-2">
        <Button type="submit" busy={busy}>{submitLabel}</Button>
        {onCancel ? <Button type="button" tone="secondary" onClick={onCancel}>Cancel</Button> : null}
      </div>
    </form>
  );
}
