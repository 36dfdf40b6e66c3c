import { describe, expect, it } from "vitest";
import { renderMarkdown } from "../../shared/markdown.ts";

// A corpus of hostile listing copy (common XSS payload shapes; common practice, no source).
const payloads = [
  "<script>alert(1)</script>",
  "<img src=x onerror=alert(1)>",
  "[click](javascript:alert(1))",
  "[click](JaVaScRiPt:alert(1))",
  "[click](  javascript:alert(1))",
  "[x](data:text/html;base64,PHNjcmlwdD5hbGVydCgxKTwvc2NyaXB0Pg==)",
  "<a href=\"javascript:alert(1)\">x</a>",
  "<svg onload=alert(1)>",
  "<iframe src=\"https://example.com\"></iframe>",
  "<div style=\"background:url(javascript:alert(1))\">x</div>",
  "![x](x\" onerror=\"alert(1))",
  "<details open ontoggle=alert(1)>",
  "**bold** <b onmouseover=alert(1)>hover</b>",
];

describe("renderMarkdown", () => {
  it("when the copy is ordinary Markdown, then it renders as HTML", () => {
    const html = renderMarkdown("# Clean car\n\n**Full** service history.\n\n- Tow bar\n- Roof racks\n\n[Call us](tel:+61755501482)");
    expect(html).toContain("<h2>Clean car</h2>");
    expect(html).toContain("<strong>Full</strong>");
    expect(html).toContain("<li>Tow bar</li>");
    expect(html).toContain('href="tel:+61755501482"');
  });

  it.each(payloads)("when the copy contains %s, then no executable markup survives", (payload) => {
    const html = renderMarkdown(payload);
    // Escaped text (&lt;img …&gt;) is harmless; only real tags matter.
    const tags = html.match(/<[a-z][^>]*>/gi) ?? [];
    for (const tag of tags) {
      expect(tag).not.toMatch(/^<(script|img|svg|iframe|details|div|object|embed|style)/i);
      expect(tag).not.toMatch(/\son\w+\s*=|javascript:|data:|style=/i);
    }
  });

  it("when raw HTML is written, then it is shown as text rather than dropped silently", () => {
    expect(renderMarkdown("Price <b>firm</b>")).toContain("&lt;b&gt;firm&lt;/b&gt;");
  });

  it("when there is no copy, then the result is empty", () => {
    expect(renderMarkdown(null)).toBe("");
  });
});
