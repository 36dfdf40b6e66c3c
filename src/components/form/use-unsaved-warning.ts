import { useEffect } from "react";

/** While something typed is unsaved, leaving or reloading the page asks first (the browser words the question). */
export function useUnsavedWarning(dirty: boolean) {
  useEffect(() => {
    const warn = (e: BeforeUnloadEvent) => {
      if (dirty) e.preventDefault();
    };
    window.addEventListener("beforeunload", warn);
    return () => window.removeEventListener("beforeunload", warn);
  }, [dirty]);
}
