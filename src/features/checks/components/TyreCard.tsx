import { useId, type ReactNode } from "react";
import { TYRE_POSITION_LABELS, type TyrePosition } from "../../../../shared/constants/evidence.ts";
import { liveAssessment, TREAD_FIELDS, TREAD_LABELS, type FieldErrors, type TyreField, type TyreForm, type TyreRules } from "../form-model.ts";
import { Measure } from "./inputs.tsx";
import { TyreFigures } from "./TyreFigures.tsx";

interface Props {
  position: TyrePosition;
  value: TyreForm;
  measuredOn: string;
  rules: TyreRules;
  locale: string;
  errors: FieldErrors;
  /** The front left size, offered to the other positions as a one-tap copy. */
  copySize?: string;
  onChange: (field: TyreField, value: string) => void;
  /** Beside the heading (the spare's "No spare / not measured"). */
  action?: ReactNode;
}

/** Digits only; a whole TIN pasted from a photo ("DOT U2LL LMLR 2319") keeps its last group, the date code. */
const dotDigits = (v: string) => (/[a-z]/i.test(v) ? (v.trim().split(/\s+/).at(-1) ?? "") : v).replace(/\D/g, "").slice(0, 4);

/** One wheel position: three tread depths, size, DOT date code and pressure, with the live figures beside them. */
export function TyreCard({ position, value, measuredOn, rules, locale, errors, copySize, onChange, action }: Props) {
  const headingId = useId();
  const treadErrorsId = useId();
  const label = TYRE_POSITION_LABELS[position];
  const err = (f: string) => errors[`tyre.${position}.${f}`];
  const treadErrors = TREAD_FIELDS.map((f) => err(f)).filter(Boolean);
  const assessment = liveAssessment(position, value, rules, measuredOn);
  const canCopy = copySize !== undefined && copySize.trim() !== "" && copySize.trim().toUpperCase() !== value.sizeDesignation.trim().toUpperCase();
  return (
    <section aria-labelledby={headingId} className="rounded-lg border border-line bg-paper-raised p-4" data-position={position}>
      <div className="mb-3 flex flex-wrap items-center justify-between gap-2">
        <h3 id={headingId} className="text-lg font-bold">
          {label}
        </h3>
        {action}
      </div>
      <div className="flex flex-col gap-4">
        {err("_") ? <p className="text-sm font-bold text-brick">{err("_")}</p> : null}
        <fieldset className="min-w-0">
          <legend className="mb-1 text-sm font-bold">
            Tread depth <span className="unit">(mm, to 1 decimal place)</span>
          </legend>
          <div className="grid grid-cols-3 gap-2">
            {TREAD_FIELDS.map((f) => (
              <Measure
                key={f}
                label={TREAD_LABELS[f]}
                aria-label={`${label} ${TREAD_LABELS[f].toLowerCase()} tread`}
                inputMode="decimal"
                enterKeyHint="next"
                placeholder="–"
                className="figures text-center text-lg"
                value={value[f]}
                invalid={Boolean(err(f))}
                errorId={treadErrorsId}
                onValue={(v) => onChange(f, v)}
              />
            ))}
          </div>
          {treadErrors.length ? (
            <ul id={treadErrorsId} className="mt-1 flex flex-col gap-0.5 text-sm font-bold text-brick">
              {treadErrors.map((m) => (
                <li key={m}>{m}</li>
              ))}
            </ul>
          ) : null}
        </fieldset>
        <Measure
          label="Size"
          aria-label={`${label} size`}
          placeholder="235/60 R18 103V"
          className="font-mono uppercase"
          spellCheck={false}
          autoCapitalize="characters"
          value={value.sizeDesignation}
          error={err("sizeDesignation")}
          onValue={(v) => onChange("sizeDesignation", v.toUpperCase())}
          labelAction={
            copySize !== undefined ? (
              <button
                type="button"
                className="-my-2 min-h-11 rounded-md px-2 text-sm font-bold text-signal hover:bg-signal-wash disabled:text-ink-faint"
                disabled={!canCopy}
                onClick={() => onChange("sizeDesignation", copySize.trim().toUpperCase())}
              >
                Same as front left
              </button>
            ) : null
          }
        />
        <div className="grid grid-cols-2 gap-3">
          <Measure
            label="DOT date code"
            aria-label={`${label} DOT date code`}
            inputMode="numeric"
            placeholder="2319"
            className="figures font-mono"
            value={value.dotCode}
            error={err("dotCode")}
            hint="Last 4 digits: week, year"
            onValue={(v) => onChange("dotCode", dotDigits(v))}
          />
          <Measure
            label="Pressure"
            aria-label={`${label} pressure`}
            unit="kPa"
            inputMode="numeric"
            placeholder="–"
            className="figures"
            value={value.pressureKpa}
            error={err("pressureKpa")}
            onValue={(v) => onChange("pressureKpa", v)}
          />
        </div>
        <TyreFigures assessment={assessment} dotCode={value.dotCode} rules={rules} locale={locale} />
      </div>
    </section>
  );
}
