import { useEffect, useMemo, useRef, useState, type FormEvent } from "react";
import { useNavigate } from "react-router";
import { computeDerived } from "../../../../shared/domain/derived.ts";
import { derivedInputOf } from "../../../../shared/domain/derived-input.ts";
import { dealershipDay } from "../../../../shared/domain/calendar.ts";
import { createVehicleSchema, updateVehicleSchema } from "../../../../shared/schemas/vehicles.ts";
import { canEditGroup, fieldGroup } from "../../../../shared/constants/vehicle-fields.ts";
import type { Role } from "../../../../shared/constants/roles.ts";
import { zodFields } from "../../../../shared/schemas/fields.ts";
import { isApiError } from "../../../lib/api-client.ts";
import { useCreateVehicle, useUpdateVehicle, type VehicleRecord as VehicleView } from "../api/vehicles.ts";
import type { DealershipView } from "../../settings/api/dealership.ts";
import { FIELDS, SECTIONS, type FieldDef } from "./fields.ts";
import { changedFields, emptyForm, formFromVehicle, formToInput, liveNumber, type VehicleForm } from "./form-model.ts";
import { clearDraft, loadDraft, saveDraft } from "./draft.ts";
import { useOwnMoves } from "./own-moves.ts";
import { LiveFigures } from "./LiveFigures.tsx";
import { ServiceHistoryEditor } from "./ServiceHistoryEditor.tsx";
import { FeaturesInput } from "./FeaturesInput.tsx";
import { DescriptionEditor } from "./DescriptionEditor.tsx";
import { SelectField, TextField } from "../../../components/form/Field.tsx";
import { Button } from "../../../components/ui/Button.tsx";
import { Notice } from "../../../components/feedback/Notice.tsx";
import { useUnsavedWarning } from "../../../components/form/use-unsaved-warning.ts";

interface Props {
  vehicle?: VehicleView;
  dealership: DealershipView;
  role: Role;
}

/** The vehicle editor: sections of fields, the derived figures beside them, a draft kept as you type, and no lost edits. */
export function VehicleEditor({ vehicle, dealership, role }: Props) {
  const navigate = useNavigate();
  const draftId = vehicle?.id ?? "new";
  const [base, setBase] = useState<VehicleView | undefined>(vehicle);
  const initial = useMemo(() => (vehicle ? formFromVehicle(vehicle) : emptyForm(dealership.distanceUnit)), [vehicle, dealership.distanceUnit]);
  const [restored] = useState(() => loadDraft(draftId));
  const [form, setForm] = useState<VehicleForm>(() => restored?.form ?? initial);
  const [draftNotice, setDraftNotice] = useState(restored ? restored.savedAt : null);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [conflict, setConflict] = useState<{ fields: string[]; by: VehicleView } | null>(null);
  const [saved, setSaved] = useState(false);
  const create = useCreateVehicle();
  const update = useUpdateVehicle(vehicle?.id ?? 0);
  const mutation = vehicle ? update : create;
  const firstError = useRef<HTMLDivElement>(null);
  const sentBody = useRef<unknown>(null);
  const ownMoves = useOwnMoves(sentBody);

  const input = useMemo(() => formToInput(form), [form]);
  const baseInput = useMemo(() => (base ? formToInput(formFromVehicle(base)) : formToInput(initial)), [base, initial]);
  const dirty = Object.keys(changedFields(input, baseInput)).length > 0;

  // A status move or publish by this person (side panel) bumps the version: the record it brings becomes the base,
  // with their unsaved edits still on top, so their next save is not refused as a conflict with themselves. Only
  // while none of the editor's fields differ from the base; if they do, someone else saved too, and the conflict
  // notice lets the person choose. (Adjusted during render, React's pattern for state that follows a prop.)
  const [seenVersion, setSeenVersion] = useState(vehicle?.version);
  if (vehicle && vehicle.version !== seenVersion) {
    setSeenVersion(vehicle.version);
    const own = base && vehicle.version > base.version && ownMoves.any && !conflict;
    if (own && !Object.keys(changedFields(formToInput(formFromVehicle(vehicle)), baseInput)).length) {
      setBase(vehicle);
      ownMoves.taken();
    }
  }

  // Keep the draft as the person types; drop it once nothing differs from the saved record.
  useEffect(() => {
    const t = setTimeout(() => {
      if (dirty) saveDraft(draftId, { form, baseVersion: base?.version ?? null, savedAt: new Date().toISOString() });
      else clearDraft(draftId);
    }, 300);
    return () => clearTimeout(t);
  }, [form, dirty, draftId, base?.version]);

  useUnsavedWarning(dirty);

  const derived = useMemo(() => {
    return computeDerived(
      derivedInputOf(input),
      {
        today: dealershipDay(dealership.timeZone),
        checkDigitMandatory: dealership.vinCheckDigitMandatory,
        serviceIntervalKm: dealership.serviceIntervalKm,
        serviceIntervalMonths: dealership.serviceIntervalMonths,
      },
    );
  }, [input, dealership]);

  const editable = (name: string) => {
    const g = fieldGroup(name);
    return g ? canEditGroup(role, g) : false;
  };

  function setValue(name: string, value: string) {
    setSaved(false);
    setForm((f) => ({ ...f, values: { ...f.values, [name]: value } }));
  }

  function discardDraft() {
    clearDraft(draftId);
    setForm(base ? formFromVehicle(base) : initial);
    setDraftNotice(null);
    setErrors({});
  }

  function submit(e: FormEvent) {
    e.preventDefault();
    setSaved(false);
    const today = dealershipDay(dealership.timeZone);
    const body = base ? { ...changedFields(input, baseInput), version: base.version } : Object.fromEntries(Object.entries(input).filter(([, v]) => v !== null));
    // The same schema the server uses, so most mistakes are shown before anything is sent.
    const check = (base ? updateVehicleSchema(today) : createVehicleSchema(today)).safeParse(body);
    if (!check.success) {
      setErrors(zodFields(check.error));
      requestAnimationFrame(() => firstError.current?.scrollIntoView({ block: "center" }));
      return;
    }
    setErrors({});
    sentBody.current = body;
    mutation.mutate(body, {
      onSuccess: ({ vehicle: v }) => {
        clearDraft(draftId);
        setDraftNotice(null);
        setConflict(null);
        setBase(v);
        setForm(formFromVehicle(v));
        setSaved(true);
        if (!base) void navigate(`/app/vehicles/${v.id}`, { replace: true });
      },
      onError: (err) => {
        if (!isApiError(err)) return;
        setErrors(err.fields);
        if (err.code === "stale_version" && err.details.current && base) {
          const current = err.details.current as VehicleView;
          const theirs = changedFields(formToInput(formFromVehicle(current)), baseInput);
          setConflict({ fields: Object.keys(theirs), by: current });
        }
      },
    });
  }

  /** Takes the newer record as the base; the person's own edits stay in the form, ready to save again. */
  function rebaseOnTheirs() {
    if (!conflict) return;
    const theirsForm = formFromVehicle(conflict.by);
    const mine = changedFields(input, baseInput);
    setForm((f) => {
      const values = { ...theirsForm.values };
      for (const k of Object.keys(f.values)) if (k in mine || (k === "odometerUnit" && "odometerReading" in mine)) values[k] = f.values[k];
      return {
        values,
        features: "features" in mine ? f.features : theirsForm.features,
        serviceHistory: "serviceHistory" in mine ? f.serviceHistory : theirsForm.serviceHistory,
      };
    });
    setBase(conflict.by);
    setConflict(null);
  }

  const serverError = mutation.error && !Object.keys(errors).length && !conflict ? mutation.error : null;
  const field = (f: FieldDef) => {
    const common = { key: f.name, label: f.label, name: f.name, error: errors[f.name], hint: f.hint, disabled: !editable(f.name) };
    const value = form.values[f.name] ?? "";
    if (f.kind === "enum")
      return (
        <SelectField {...common} value={value} onChange={(e) => setValue(f.name, e.target.value)}>
          {f.name !== "odometerUnit" ? <option value="">Not recorded</option> : null}
          {f.options!.map(([v, l]) => <option key={v} value={v}>{l}</option>)}
        </SelectField>
      );
    return (
      <TextField
        {...common}
        value={value}
        type={f.kind === "date" ? "date" : "text"}
        inputMode={f.kind === "int" ? "numeric" : f.kind === "number" || f.kind === "money" ? "decimal" : undefined}
        className={`${f.mono ? "font-mono" : ""} ${f.upper ? "uppercase" : ""} ${f.kind !== "text" ? "figures" : ""}`}
        after={f.unit ? <span className="unit whitespace-nowrap">{f.unit}</span> : f.kind === "money" ? <span className="unit">{dealership.currency}</span> : undefined}
        onChange={(e) => setValue(f.name, f.upper ? e.target.value.toUpperCase() : e.target.value)}
        spellCheck={f.mono ? false : undefined}
        autoComplete="off"
      />
    );
  };

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-6" aria-label={vehicle ? "Edit vehicle" : "New vehicle"}>
      {draftNotice ? (
        <Notice tone="caution" title="Unsaved changes restored">
          These edits were kept in this browser on {new Date(draftNotice).toLocaleString()}. Save them, or{" "}
          <button type="button" className="font-bold text-signal underline" onClick={discardDraft}>discard them</button>.
        </Notice>
      ) : null}
      {conflict ? (
        <Notice tone="caution" title="Someone saved this vehicle after you opened it">
          <p>They changed: {conflict.fields.length ? conflict.fields.join(", ") : "the record's status"}. Your edits were not saved and are still in the form.</p>
          <button type="button" className="mt-2 min-h-11 rounded-md border border-line-strong bg-paper-raised px-3 font-bold" onClick={rebaseOnTheirs}>
            Take their changes, keep mine on top
          </button>
        </Notice>
      ) : null}
      {serverError ? (
        <Notice tone="danger" title={serverError.message}>
          {serverError.status === 401 ? "Sign in again in another tab; your edits are kept here and in this browser." : null}
        </Notice>
      ) : null}
      {Object.keys(errors).length ? (
        <div ref={firstError}>
          <Notice tone="danger" title={`${Object.keys(errors).length} field${Object.keys(errors).length === 1 ? "" : "s"} need attention`}>
            Nothing was saved. The fields are marked below.
          </Notice>
        </div>
      ) : null}
      {saved ? <Notice tone="success" title="Saved" /> : null}

      {SECTIONS.map((s) => {
        const locked = !canEditGroup(role, s.group);
        return (
          <section key={s.group} aria-labelledby={`sec-${s.group}`} className="rounded-lg border border-line bg-paper-raised p-5">
            <div className="mb-4 flex flex-wrap items-baseline justify-between gap-2">
              <h2 id={`sec-${s.group}`} className="text-lg font-bold">{s.title}</h2>
              {locked ? <span className="text-xs text-ink-soft">Your role can read this section but not change it.</span> : null}
            </div>
            <p className="-mt-2 mb-4 text-sm text-ink-soft">{s.lead}</p>
            <div className="grid gap-6 lg:grid-cols-[1fr_16rem]">
              <div className="flex flex-col gap-4">
                <div className="grid gap-4 sm:grid-cols-2">{FIELDS.filter((f) => f.group === s.group).map(field)}</div>
                {s.group === "history" ? (
                  <ServiceHistoryEditor
                    rows={form.serviceHistory}
                    flags={derived.odometerFlags}
                    errors={errors}
                    disabled={locked}
                    onChange={(rows) => setForm((f) => ({ ...f, serviceHistory: rows }))}
                  />
                ) : null}
                {s.group === "listing" ? (
                  <>
                    <FeaturesInput value={form.features} disabled={locked} error={errors.features} onChange={(v) => setForm((f) => ({ ...f, features: v }))} />
                    <DescriptionEditor value={form.values.description ?? ""} disabled={locked} error={errors.description} onChange={(v) => setValue("description", v)} />
                  </>
                ) : null}
              </div>
              <LiveFigures
                group={s.group}
                derived={derived}
                input={{
                  powerKw: liveNumber(input.powerKw),
                  torqueNm: liveNumber(input.torqueNm),
                  fuelConsumptionL100km: liveNumber(input.fuelConsumptionL100km),
                  buildYear: liveNumber(input.buildYear),
                }}
                locale={dealership.locale}
                distanceUnit={dealership.distanceUnit}
              />
            </div>
          </section>
        );
      })}

      <div className="sticky bottom-0 -mx-5 flex items-center gap-4 border-t border-line bg-paper/95 px-5 py-3 backdrop-blur">
        <Button type="submit" busy={mutation.isPending} disabled={Boolean(base) && !dirty}>
          {vehicle ? "Save changes" : "Add to stock"}
        </Button>
        <span className="text-sm text-ink-soft" aria-live="polite">
          {dirty ? "Unsaved changes (kept in this browser)" : base ? "All changes saved" : ""}
        </span>
      </div>
    </form>
  );
}
