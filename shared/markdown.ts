// Listing copy and disclaimers are Markdown written by staff. They are rendered with marked, raw HTML in the
// source is shown as text (never parsed), and the output passes an allow-list filter (js-xss) so no script,
// event handler, style or javascript: link can reach a buyer's browser. Used by the server and the editor preview.
import { Marked } from "marked";
import { FilterXSS } from "xss";

const escapeHtml = (s: string) => s.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;").replace(/"/g, "&quot;");

const marked = new Marked({
  gfm: true,
  breaks: false,
  async: false,
  renderer: {
    // Raw HTML blocks and inline tags are displayed, not interpreted.
    html: ({ text }) => escapeHtml(text),
  },
});

const SAFE_URL = /^(https?:|mailto:|tel:|\/(?!\/)|#)/i;

const filter = new FilterXSS({
  whiteList: {
    p: [], br: [], strong: [], em: [], del: [], code: [], pre: [], blockquote: [], hr: [],
    ul: [], ol: ["start"], li: [], h2: [], h3: [], h4: [],
    a: ["href", "title", "rel"],
    table: [], thead: [], tbody: [], tr: [], th: ["align"], td: ["align"],
  },
  stripIgnoreTag: true,
  stripIgnoreTagBody: ["script", "style", "iframe", "object", "embed", "svg", "math"],
  onTagAttr: (tag, name, value) => {
    if (tag === "a" && name === "href") {
      const v = value.trim();
      return SAFE_URL.test(v) ? `href="${escapeHtml(v)}" rel="nofollow noopener"` : "";
    }
    return undefined;
  },
});

/** Staff Markdown to inert HTML. Headings are shifted down (h1 → h2) so copy never competes with the page title. */
export function renderMarkdown(source: string | null | undefined): string {
  if (!source) return "";
  const html = marked.parse(source.replace(/^(#{1,3})(\s)/gm, "#$1$2")) as string;
  return filter.process(html);
}
