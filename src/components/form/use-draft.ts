import { useState, type Dispatch, type SetStateAction } from "react";

/**
 * What the person is typing into a field whose value lives elsewhere (a search box over the URL): it starts again
 * from `value` whenever `key` changes from outside, so back and forward put the field back as it was. The reset
 * happens during render, not in an effect, so no frame shows the old text (react.dev, "You might not need an
 * effect": adjusting state when a prop changes).
 */
export function useDraft<T>(value: T, key: unknown = value): [T, Dispatch<SetStateAction<T>>] {
  const [draft, setDraft] = useState(value);
  const [seen, setSeen] = useState(key);
  if (!Object.is(seen, key)) {
    setSeen(key);
    setDraft(value);
  }
  return [draft, setDraft];
}
