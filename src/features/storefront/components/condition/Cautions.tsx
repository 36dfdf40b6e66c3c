import type { Caution } from "../../../../../shared/domain/cautions.ts";
import { Section } from "./Section.tsx";

/** The report's cautions: safety ones first and prominent, each saying what to do. */
export function Cautions({ cautions }: { cautions: Caution[] }) {
  const blocks = cautions.filter((c) => c.level === "block");
  const advises = cautions.filter((c) => c.level !== "block");
  return (
    // On paper an empty list of cautions is left off; the notes on the report still print.
    <Section id="cautions" title="Cautions" className={cautions.length === 0 ? "print:hidden" : ""}>
      {cautions.length === 0 ? (
        <p className="rounded-md border border-line bg-paper-raised px-4 py-3">Nothing we recorded calls for a caution. The notes on this report below still apply.</p>
      ) : null}
      {blocks.length ? (
        <div role="note" className="fr-caution-block rounded-lg border-2 border-brick bg-brick-wash px-4 py-4 sm:px-5">
          <p className="text-lg font-bold text-brick">Safety: to be put right before the vehicle is used on the road</p>
          <CautionList cautions={blocks} word="Safety" />
        </div>
      ) : null}
      {advises.length ? (
        <div className={`fr-caution-advise rounded-lg border border-l-4 border-ochre bg-ochre-wash px-4 py-4 sm:px-5 ${blocks.length ? "mt-4" : ""}`}>
          <p className="font-bold">Advisories: worth knowing, and worth asking about</p>
          <CautionList cautions={advises} word="Advisory" />
        </div>
      ) : null}
    </Section>
  );
}

/** Each caution says its level in words, so the list reads the same without the colour and on paper. */
function CautionList({ cautions, word }: { cautions: Caution[]; word: string }) {
  return (
    <ul className="mt-2 flex flex-col gap-2">
      {cautions.map((c) => (
        <li key={c.code} data-caution={c.code}>
          <strong>{word}:</strong> {c.text}
        </li>
      ))}
    </ul>
  );
}
