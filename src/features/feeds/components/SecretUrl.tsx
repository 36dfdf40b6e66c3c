import { useState } from "react";
import { Button } from "../../../components/ui/Button.tsx";

/** The secret URL, shown once after create or rotate. */
export function SecretUrl({ url, onDone }: { url: string; onDone: () => void }) {
  const [copied, setCopied] = useState(false);
  async function copy() {
    try {
      await navigator.clipboard.writeText(url);
      setCopied(true);
    } catch {
      setCopied(false);
    }
  }
  return (
    <section role="status" aria-label="The feed's secret URL" className="rounded-lg border-2 border-signal bg-signal-wash p-5">
      <h2 className="text-lg font-bold">Save this URL now: it will not be shown again</h2>
      <p className="mt-1 max-w-prose text-sm">
        Give it to the portal. Anyone with it can read the feed, so send it privately. We keep only a fingerprint of it; if it is lost,
        rotate the URL and send the new one.
      </p>
      <div className="mt-3 flex flex-wrap items-center gap-2">
        <code data-testid="secret-url" className="min-w-0 flex-1 break-all rounded-md border border-line-strong bg-paper-raised px-3 py-2 font-mono text-sm">
          {url}
        </code>
        <Button type="button" onClick={() => void copy()}>
          {copied ? "Copied" : "Copy URL"}
        </Button>
        <Button type="button" tone="secondary" onClick={onDone}>
          I have saved it
        </Button>
      </div>
    </section>
  );
}
