import { useEffect } from "react";
import { useNavigationType } from "react-router";

/** A page opened by a link starts at its top; one reached with back or forward keeps the browser's own scroll. */
export function useScrollTopOnOpen(key: string) {
  const type = useNavigationType();
  useEffect(() => {
    if (type !== "POP" && !window.location.hash) window.scrollTo({ top: 0 });
  }, [key]);
}
