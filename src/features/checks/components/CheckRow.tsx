import { useId, useState } from "react";
import { CHECK_LABELS, CHECK_RESULT_LABELS, CHECK_RESULTS, type CheckItem } from "../../../../shared/constants/evidence.ts";
import { isSafetyCheckItem } from "../../../../shared/domain/condition-rules.ts";
import type { CheckForm } from "../form-model.ts";
import { controlClass, Tag } from "./inputs.tsx";

// The chosen answer shows by its filled radio, a heavier border and bold text, the same for all three: the words carry
// the severity, never a traffic-light tint (STYLE.md; the public page reads the same way).
const CHOSEN = "border-2 border-ink bg-paper-raised";

interface Props {
  item: CheckItem;
  value: CheckForm;
  saved?: { checkedOn: string; checkedBy: string | null };
  errors: Record<string, string | undefined>;
  onChange: (value: CheckForm) => void;
}

/** One check: a three-way Pass / Advise / Fail choice with visible labels, and a note that says what to do. */
export function CheckRow({ item, value, saved, errors, onChange }: Props) {
  const name = useId();
  const noteId = useId();
  const label = CHECK_LABELS[item];
  const safety = isSafetyCheckItem(item);
  const needsNote = value.result === "advise" || value.result === "fail";
  const noteMissing = needsNote && value.note.trim() === "";
  const err = (f: string) => errors[`check.${item}.${f}`];
  const [noteOpen, setNoteOpen] = useState(false);
  // A pass rarely needs words, so its note opens on request; advise and fail ask for one straight away.
  const showNote = needsNote || value.note !== "" || noteOpen || Boolean(err("note"));
  return (
    <fieldset className="min-w-0 border-t border-line py-4 first:border-t-0" data-item={item}>
      <legend className="float-left flex w-full flex-wrap items-center gap-2 pb-2">
        <span className="text-base font-bold">{label}</span>
        {safety ? <Tag tone="safety">Safety item</Tag> : null}
        {value.result === "" ? <span className="text-xs text-ink-soft">Not checked yet</span> : null}
      </legend>
      <div className="clear-left grid grid-cols-3 gap-2">
        {CHECK_RESULTS.map((r) => {
          const chosen = value.result === r;
          return (
            <label
              key={r}
              className={`flex min-h-12 cursor-pointer items-center justify-center gap-2 rounded-md px-2 text-base has-[:disabled]:cursor-default has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-signal ${
                chosen ? `${CHOSEN} font-bold` : "border border-line-strong bg-paper-raised"
              }`}
            >
              <input type="radio" name={name} value={r} checked={chosen} onChange={() => onChange({ ...value, result: r })} className="size-5 shrink-0 accent-ink" />
              {CHECK_RESULT_LABELS[r]}
            </label>
          );
        })}
      </div>
      {err("result") ? <p className="mt-1 text-sm font-bold text-brick">{err("result")}</p> : null}
      {value.result !== "" && !showNote ? (
        <div className="mt-2 flex flex-wrap items-center justify-between gap-2">
          <button type="button" className="min-h-11 rounded-md px-2 text-sm font-bold text-signal hover:bg-signal-wash" onClick={() => setNoteOpen(true)}>
            Add a note<span className="sr-only"> on {label}</span>
          </button>
          <ClearButton label={label} onClear={() => onChange({ ...value, result: "" })} />
        </div>
      ) : null}
      {showNote ? (
        <div className="mt-3 flex flex-col gap-1">
          <div className="flex min-h-6 items-end justify-between gap-2">
            <label htmlFor={noteId} className="text-sm font-bold">
              <span className="sr-only">{label}: </span>
              {needsNote ? "What you found and what to do" : "Note"}
              {needsNote ? null : <span className="font-normal text-ink-soft"> (optional)</span>}
            </label>
            {value.result !== "" ? <ClearButton label={label} onClear={() => onChange({ ...value, result: "" })} /> : null}
          </div>
          <textarea
            id={noteId}
            rows={2}
            value={value.note}
            placeholder={needsNote ? "Say what you found and what to do" : ""}
            aria-invalid={Boolean(err("note"))}
            aria-describedby={`${noteId}-hint`}
            onChange={(e) => onChange({ ...value, note: e.target.value })}
            className={`${controlClass} min-h-20 ${noteMissing ? "border-2 border-ochre" : ""}`}
          />
          {err("note") ? (
            <p id={`${noteId}-hint`} className="text-sm font-bold text-brick">
              {err("note")}
            </p>
          ) : noteMissing ? (
            <p id={`${noteId}-hint`} className="text-sm font-bold text-ochre">
              Needed for {value.result === "fail" ? "a fail" : "an advise"}: say what you found and what to do, like “Rear pads worn to 2 mm; replace before sale”.
            </p>
          ) : value.result === "" ? (
            <p id={`${noteId}-hint`} className="text-sm text-ink-soft">
              Choose Pass, Advise or Fail; an unanswered check is not saved, nor its note.
            </p>
          ) : saved ? (
            <p id={`${noteId}-hint`} className="text-xs text-ink-soft">
              Recorded {saved.checkedOn}
              {saved.checkedBy ? ` by ${saved.checkedBy}` : ""}
            </p>
          ) : (
            <span id={`${noteId}-hint`} hidden />
          )}
        </div>
      ) : null}
      {saved && !showNote ? (
        <p className="mt-1 text-xs text-ink-soft">
          Recorded {saved.checkedOn}
          {saved.checkedBy ? ` by ${saved.checkedBy}` : ""}
        </p>
      ) : null}
    </fieldset>
  );
}

function ClearButton({ label, onClear }: { label: string; onClear: () => void }) {
  return (
    <button type="button" className="-my-2 min-h-11 rounded-md px-2 text-sm font-bold text-signal hover:bg-signal-wash" onClick={onClear}>
      Clear<span className="sr-only"> the {label} answer</span>
    </button>
  );
}
