import { useEffect } from "react";

/** Sets the tab's title while the page is shown (the server writes the first one into the HTML for link previews). */
export function useDocumentTitle(title: string) {
  useEffect(() => {
    document.title = title;
  }, [title]);
}
