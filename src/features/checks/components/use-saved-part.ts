import { useMemo, useState } from "react";

/**
 * One part of the checks screen that saves on its own and carries its own version (the tyre readings, or the
 * checks): the version last saved (the base), the form as typed, and the moves between them. `held` is true while
 * the part is in a conflict the person has not settled, so a newer saved version does not replace their typing.
 */
export function useSavedPart<V extends { version: number }, F>(
  saved: V,
  formOf: (view: V, day: string) => F,
  changed: (form: F, base: F) => boolean,
  { today, held }: { today: string; held: boolean },
) {
  const [base, setBase] = useState(saved);
  const baseForm = useMemo(() => formOf(base, today), [formOf, base, today]);
  const [form, setForm] = useState(() => formOf(saved, today));
  const dirty = changed(form, baseForm);

  // A newer saved version (someone else, read on window focus) replaces the form only while nothing is typed in it.
  // Checked when the saved version arrives, during render (react.dev, "You might not need an effect").
  const [seen, setSeen] = useState(saved);
  if (saved !== seen) {
    setSeen(saved);
    if (saved.version > base.version && !dirty && !held) {
      setBase(saved);
      setForm(formOf(saved, today));
    }
  }

  return {
    base,
    baseForm,
    form,
    dirty,
    edit: setForm,
    /** After a save: the answer is the base, and replaces the form unless the person typed on while it was on its way. */
    adopt: (view: V, sent: F, day: string) => {
      setBase(view);
      setForm((now) => (now === sent ? formOf(view, day) : now));
    },
    /** Their version replaces what was typed. */
    takeTheirs: (view: V) => {
      setBase(view);
      setForm(formOf(view, today));
    },
    /** Theirs become the base; what was typed stays in the form, ready to save over them. */
    keepMine: (view: V) => setBase(view),
  };
}
