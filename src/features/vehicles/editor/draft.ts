import type { VehicleForm } from "./form-model.ts";

/**
 * Unsaved edits are kept in this browser (localStorage) as they are typed, so a closed tab, a crash or an expired
 * session loses nothing. A draft remembers the version it was based on.
 */
export interface Draft {
  form: VehicleForm;
  baseVersion: number | null;
  savedAt: string;
}

const key = (id: number | "new") => `forthright:vehicle-draft:${id}`;

export function loadDraft(id: number | "new"): Draft | null {
  try {
    const raw = localStorage.getItem(key(id));
    return raw ? (JSON.parse(raw) as Draft) : null;
  } catch {
    return null;
  }
}

export function saveDraft(id: number | "new", draft: Draft): void {
  try {
    localStorage.setItem(key(id), JSON.stringify(draft));
  } catch {
    // Storage full or disabled: the form itself still holds the edits.
  }
}

export function clearDraft(id: number | "new"): void {
  try {
    localStorage.removeItem(key(id));
  } catch {
    /* nothing to clear */
  }
}
