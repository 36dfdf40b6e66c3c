import { useState } from "react";
import { isDefectCaution, type Caution } from "../../../../shared/domain/cautions.ts";
import { Tag } from "./inputs.tsx";

type Shown = Caution & { state: "saved" | "new" | "clears" };

/**
 * The server's cautions for the saved record; while the form differs from it, the ones the typed values would give
 * are merged in and marked, so the person sees what saving will change.
 */
export function CautionsPanel({ saved, live, editing }: { saved: readonly Caution[]; live: readonly Caution[]; editing: boolean }) {
  const shown: Shown[] = editing
    ? [
        ...live.map((c) => ({ ...c, state: saved.some((s) => s.code === c.code) ? ("saved" as const) : ("new" as const) })),
        ...saved.filter((s) => !live.some((c) => c.code === s.code)).map((c) => ({ ...c, state: "clears" as const })),
      ]
    : saved.map((c) => ({ ...c, state: "saved" as const }));
  const blocks = shown.filter((c) => c.level === "block");
  const advises = shown.filter((c) => c.level === "advise");
  const activeBlocks = blocks.filter((c) => c.state !== "clears");
  // Advisories fold away when there are several, so the tyres are not pushed off a phone's screen; blocks never fold.
  const [chosen, setChosen] = useState<boolean | null>(null);
  const advisoriesOpen = chosen ?? advises.length <= 2;

  return (
    <section aria-labelledby="cautions-heading" className="flex flex-col gap-3">
      <h2 id="cautions-heading" className="text-lg font-bold">
        Cautions
      </h2>
      {shown.length === 0 ? (
        <p className="rounded-md border border-line bg-paper-raised px-4 py-3 text-sm">
          Nothing recorded here calls for a caution. Record all four road tyres and every safety item before the vehicle is published.
        </p>
      ) : null}
      {blocks.length ? (
        <div className="rounded-md border-2 border-brick bg-brick-wash px-4 py-3">
          <p className="font-bold text-brick">
            {activeBlocks.length ? "Safety: must be repaired before sale for road use" : "Safety cautions that saving will clear"}
          </p>
          {activeBlocks.length ? (
            <p className="mt-1 text-sm">
              The vehicle must be repaired before it is sold for road use. Publishing is blocked until then: fix each item below, then record the new reading or
              check here.
              {activeBlocks.some(isDefectCaution) ? " A defect that affects safety clears on the walk-around, once it is marked “Repaired before sale”." : null}
            </p>
          ) : null}
          <CautionList cautions={blocks} className="mt-2" />
        </div>
      ) : null}
      {advises.length ? (
        <details
          open={advisoriesOpen}
          className="group rounded-md border border-l-4 border-ochre bg-ochre-wash px-4 py-1"
        >
          <summary
            onClick={(e) => {
              e.preventDefault();
              setChosen(!advisoriesOpen);
            }}
            className="flex min-h-11 cursor-pointer list-none items-center justify-between gap-3 py-2 font-bold [&::-webkit-details-marker]:hidden">
            <span>
              {advises.length} advisor{advises.length === 1 ? "y" : "ies"}: tell the buyer, or put {advises.length === 1 ? "it" : "them"} right before sale
            </span>
            <span className="shrink-0 text-sm text-signal">
              <span className="group-open:hidden">Show</span>
              <span className="hidden group-open:inline">Hide</span>
            </span>
          </summary>
          <CautionList cautions={advises} className="mb-2" />
        </details>
      ) : null}
    </section>
  );
}

function CautionList({ cautions, className }: { cautions: Shown[]; className: string }) {
  return (
    <ul className={`${className} flex flex-col gap-2`}>
      {cautions.map((c) => (
        <CautionItem key={c.code} caution={c} />
      ))}
    </ul>
  );
}

function CautionItem({ caution: c }: { caution: Shown }) {
  return (
    <li className={`text-sm ${c.state === "clears" ? "text-ink-soft line-through decoration-1" : ""}`} data-caution={c.code}>
      <span className="mr-1 font-bold">{c.level === "block" ? "Safety:" : "Advisory:"}</span>
      {c.text}
      {c.state === "new" ? (
        <span className="ml-2 no-underline">
          <Tag>Not saved yet</Tag>
        </span>
      ) : null}
      {c.state === "clears" ? (
        <span className="ml-2 inline-block no-underline">
          <Tag>Clears when you save</Tag>
        </span>
      ) : null}
    </li>
  );
}
