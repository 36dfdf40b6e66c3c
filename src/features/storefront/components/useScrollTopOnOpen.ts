import { useEffect, useEffectEvent } from "react";
import { NavigationType, useNavigationType } from "react-router";

/** A page opened by a link starts at its top; one reached with back or forward keeps the browser's own scroll. */
export function useScrollTopOnOpen(key: string) {
  const type = useNavigationType();
  // How the page was reached is read when it opens, not a reason to scroll again.
  const opened = useEffectEvent(() => {
    if (type !== NavigationType.Pop && !window.location.hash) window.scrollTo({ top: 0 });
  });
  useEffect(() => opened(), [key]);
}
