import { useId, type InputHTMLAttributes, type ReactNode, type Ref, type SelectHTMLAttributes, type TextareaHTMLAttributes } from "react";

interface FieldFrame {
  label: ReactNode;
  error?: string;
  hint?: ReactNode;
  after?: ReactNode;
}

/** React 19 passes `ref` as a prop, so react-hook-form's `register()` spreads straight onto these fields. */
type WithRef<E> = { ref?: Ref<E> };

const control =
  "w-full rounded-md border bg-paper-raised px-3 py-2 text-base text-ink placeholder:text-ink-faint min-h-11 aria-[invalid=true]:border-brick aria-[invalid=true]:bg-brick-wash/40 border-line-strong focus:border-signal";

function Frame({ id, label, error, hint, after, children }: FieldFrame & { id: string; children: ReactNode }) {
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-sm font-bold text-ink">
        {label}
      </label>
      <div className="flex items-center gap-2">
        {children}
        {after}
      </div>
      <FieldNotes id={id} error={error} hint={hint} />
    </div>
  );
}

/**
 * Under a field: its hint, which its error replaces when there is one. `announce` makes the error an alert; a screen
 * with many fields that reports them together (the checks screen's status line) turns it off.
 */
export function FieldNotes({ id, error, hint, announce = true }: { id: string; error?: string; hint?: ReactNode; announce?: boolean }) {
  return (
    <>
      {hint && !error ? (
        <p id={`${id}-hint`} className="text-xs text-ink-soft">
          {hint}
        </p>
      ) : null}
      {error ? (
        <p id={`${id}-error`} className="text-sm font-bold text-brick" role={announce ? "alert" : undefined}>
          {error}
        </p>
      ) : null}
    </>
  );
}

/** The notes an input's `aria-describedby` names: the ids FieldNotes gives them. */
export const describedBy = (id: string, error?: string, hint?: ReactNode) =>
  [error ? `${id}-error` : null, hint && !error ? `${id}-hint` : null].filter(Boolean).join(" ") || undefined;

export function TextField({ label, error, hint, after, className = "", ...rest }: FieldFrame & InputHTMLAttributes<HTMLInputElement> & WithRef<HTMLInputElement>) {
  const auto = useId();
  const id = rest.id ?? auto;
  return (
    <Frame id={id} label={label} error={error} hint={hint} after={after}>
      {/* An explicit type, text unless told: the markup says what the field is without the reader's default. */}
      <input type="text" {...rest} id={id} aria-invalid={Boolean(error)} aria-describedby={describedBy(id, error, hint)} className={`${control} ${className}`} />
    </Frame>
  );
}

export function SelectField({ label, error, hint, children, className = "", ...rest }: FieldFrame & SelectHTMLAttributes<HTMLSelectElement> & WithRef<HTMLSelectElement>) {
  const auto = useId();
  const id = rest.id ?? auto;
  return (
    <Frame id={id} label={label} error={error} hint={hint}>
      <select {...rest} id={id} aria-invalid={Boolean(error)} aria-describedby={describedBy(id, error, hint)} className={`${control} ${className}`}>
        {children}
      </select>
    </Frame>
  );
}

export function TextAreaField({ label, error, hint, className = "", ...rest }: FieldFrame & TextareaHTMLAttributes<HTMLTextAreaElement> & WithRef<HTMLTextAreaElement>) {
  const auto = useId();
  const id = rest.id ?? auto;
  return (
    <Frame id={id} label={label} error={error} hint={hint}>
      <textarea {...rest} id={id} aria-invalid={Boolean(error)} aria-describedby={describedBy(id, error, hint)} className={`${control} min-h-32 ${className}`} />
    </Frame>
  );
}

export function CheckboxField({
  label,
  error,
  ...rest
}: { label: ReactNode; error?: string } & InputHTMLAttributes<HTMLInputElement> & WithRef<HTMLInputElement>) {
  const auto = useId();
  const id = rest.id ?? auto;
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="flex min-h-11 items-center gap-3 text-base">
        <input {...rest} id={id} type="checkbox" className="size-5 accent-signal" aria-invalid={Boolean(error)} />
        {label}
      </label>
      {error ? <p className="text-sm font-bold text-brick">{error}</p> : null}
    </div>
  );
}
