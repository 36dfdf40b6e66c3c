import { useState } from "react";
import type { PublicDefect, PublicPhoto, PublicSnapshot } from "../../../../../shared/schemas/public.ts";
import { formatConditionIndex, formatNumber, withUnit } from "../../../../../shared/domain/display.ts";
import { SEVERITIES, ZONES } from "../../../../../shared/constants/evidence.ts";
import { count, dateText, kindLabel, plural, repairPlanLabel, severityLabel, zoneLabel } from "../../format.ts";
import { Picture } from "../../../../components/ui/Picture.tsx";
import { DefectNumber, DefectPinButton, defectName } from "./DefectMark.tsx";
import { Section } from "./Section.tsx";

const sizeText = (d: PublicDefect, locale: string) => withUnit(d.sizeMm, "mm", { locale });

const headline = (d: PublicDefect, locale: string) => {
  const size = sizeText(d, locale);
  return `${severityLabel(d.severity)} ${kindLabel(d.kind).toLowerCase()}${size ? `, ${size}` : ""}`;
};

/** "What we found": the condition index and how it is scored, the counts, the photos with numbered pins, and the list by zone. */
export function WhatWeFound({ snapshot, locale }: { snapshot: PublicSnapshot; locale: string }) {
  const [selected, setSelected] = useState<number | null>(null);
  const { condition, defects, photos } = snapshot;
  const inspected = dateText(snapshot.inspectedOn, locale);

  const select = (n: number) => {
    const next = selected === n ? null : n;
    setSelected(next);
    // Side by side on a wide screen: bring the row into view next to the photo. On a phone the note under the photo says it.
    if (next !== null && window.matchMedia("(min-width: 1024px)").matches) {
      document.getElementById(`defect-${next}`)?.scrollIntoView({ block: "nearest", behavior: "smooth" });
    }
  };
  const showPin = (n: number) => {
    setSelected(n);
    const pin = document.getElementById(`pin-${n}`);
    pin?.scrollIntoView({ block: "center", behavior: "smooth" });
    pin?.focus({ preventScroll: true });
  };

  return (
    <Section
      id="found"
      title="What we found"
      lead={
        <p>
          {inspected ? (
            <>
              What our staff saw and measured at the inspection on <strong>{inspected}</strong>
              {snapshot.inspectedBy ? (
                <>
                  {" "}
                  by <strong>{snapshot.inspectedBy}</strong>
                </>
              ) : null}
              . Every item is listed; nothing is left out because it is small.
            </>
          ) : (
            "What our staff saw and measured at the inspection. Every item is listed; nothing is left out because it is small."
          )}
        </p>
      }
    >
      <div className="fr-found-head grid grid-cols-1 gap-5 md:grid-cols-[minmax(0,1fr)_minmax(0,1fr)]">
        <ConditionIndex condition={condition} locale={locale} />
        <SeverityCounts condition={condition} defects={defects} locale={locale} />
      </div>

      {defects.length === 0 ? (
        <p className="mt-6 rounded-md border border-line bg-paper-raised p-4">We noted no items on this vehicle at the inspection.</p>
      ) : (
        <div className="fr-found-grid mt-8 grid grid-cols-1 gap-8 lg:grid-cols-[minmax(0,7fr)_minmax(0,5fr)]">
          <DefectMap photos={photos} defects={defects} selected={selected} onSelect={select} locale={locale} />
          <DefectList snapshot={snapshot} selected={selected} onShowPin={showPin} locale={locale} />
        </div>
      )}
      <ZoneSummary snapshot={snapshot} />
    </Section>
  );
}

function ConditionIndex({ condition, locale }: { condition: PublicSnapshot["condition"]; locale: string }) {
  const n = formatConditionIndex(condition.index, { locale });
  return (
    <div className="fr-index rounded-lg border border-line bg-paper-raised p-5">
      <h3 className="text-base font-bold">Condition index</h3>
      {n !== null ? (
        <p className="mt-1 leading-none">
          <span className="text-6xl font-bold figures">{n}</span>
          <span className="unit text-2xl">/100</span>
        </p>
      ) : (
        <p className="mt-1">Not worked out for this report.</p>
      )}
      <p className="mt-3 text-lg">{condition.sentence}</p>
      {condition.explanation.length ? (
        <details className="fr-scoring mt-4 border-t border-line pt-3">
          <summary className="inline-flex min-h-11 cursor-pointer items-center font-bold text-signal">How this is scored</summary>
          <div className="mt-2 flex flex-col gap-2 text-base">
            {condition.explanation.map((p, i) => (
              <p key={i}>{p}</p>
            ))}
          </div>
        </details>
      ) : null}
    </div>
  );
}

function SeverityCounts({ condition, defects, locale }: { condition: PublicSnapshot["condition"]; defects: PublicDefect[]; locale: string }) {
  const safety = defects.filter((d) => d.safetyRelevant).length;
  const total = SEVERITIES.reduce((sum, s) => sum + (condition.bySeverity[s] ?? 0), 0);
  return (
    <div className="fr-counts rounded-lg border border-line bg-paper-raised p-5">
      <h3 className="text-base font-bold">Items noted: {formatNumber(total, { locale })}</h3>
      <dl className="mt-3 grid grid-cols-3 gap-3">
        {SEVERITIES.map((s) => (
          <div key={s} className="rounded-md border border-line p-3 text-center">
            <dt className="text-sm">{severityLabel(s)}</dt>
            <dd className="text-3xl font-bold figures">{formatNumber(condition.bySeverity[s] ?? 0, { locale })}</dd>
          </div>
        ))}
      </dl>
      <p className="mt-3 text-sm">
        {safety === 0 ? "None of them affects safety." : <strong className="text-brick">{count(safety, "item affects", "items affect", locale)} safety: see the cautions.</strong>}{" "}
        <span className="print:hidden">Minor items are the small marks of normal use; major items are ones most buyers would want put right.</span>
      </p>
    </div>
  );
}

function DefectMap({
  photos,
  defects,
  selected,
  onSelect,
  locale,
}: {
  photos: PublicPhoto[];
  defects: PublicDefect[];
  selected: number | null;
  onSelect: (n: number) => void;
  locale: string;
}) {
  const byPhoto = new Map<number, PublicDefect[]>();
  for (const d of defects) {
    if (!d.pin || !photos[d.pin.photoIndex]) continue;
    byPhoto.set(d.pin.photoIndex, [...(byPhoto.get(d.pin.photoIndex) ?? []), d]);
  }
  const unpinned = defects.filter((d) => !d.pin || !photos[d.pin.photoIndex]).length;
  const entries = [...byPhoto.entries()].sort((a, b) => Math.min(...a[1].map((d) => d.number)) - Math.min(...b[1].map((d) => d.number)));
  return (
    <div className="fr-map min-w-0">
      <h3 className="text-xl font-bold">Where they are</h3>
      <p className="mt-1 text-ink">
        Each number on a photo matches the list.<span className="print:hidden"> Press a number to pick its item.</span>
        {unpinned ? ` ${count(unpinned, "item is", "items are", locale)} not on a photo; the list describes ${unpinned === 1 ? "it" : "them"}.` : ""}
      </p>
      {entries.length === 0 ? <p className="mt-3 text-ink-soft">No item is pinned on a photo.</p> : null}
      <div className="fr-map-photos mt-4 flex flex-col gap-6">
        {entries.map(([photoIndex, pins]) => {
          const photo = photos[photoIndex];
          const where = photo.caption.trim() || (photo.zone ? zoneLabel(photo.zone) : `Photo ${photoIndex + 1}`);
          const chosen = pins.find((d) => d.number === selected) ?? null;
          return (
            <figure key={photoIndex} className="fr-map-photo">
              <div className="relative overflow-hidden rounded-md border border-line">
                <Picture
                  photo={photo}
                  alt={`${where}, with ${plural(pins.length, "a numbered pin", "numbered pins")} for ${plural(pins.length, "item", "items")} ${pins.map((d) => d.number).join(", ")}`}
                  sizes="(min-width: 1024px) 55vw, 100vw"
                />
                {pins.map((d) => (
                  <DefectPinButton key={d.number} defect={d} selected={d.number === selected} onSelect={() => onSelect(d.number)} />
                ))}
              </div>
              {/* A figcaption must be the figure's first or last child, so the picked item's note lives inside it. */}
              <figcaption className="mt-2 text-sm">
                <strong>{where}</strong>: {plural(pins.length, "item", "items")} {pins.map((d) => d.number).join(", ")}
                <div aria-live="polite" className="print:hidden">
                  {chosen ? (
                    <p className="mt-2 rounded-md border-l-4 border-signal bg-signal-wash px-3 py-2 text-base">
                      <strong>
                        {chosen.number}. {headline(chosen, locale)}.
                      </strong>{" "}
                      {chosen.note ? `${chosen.note}. ` : ""}
                      {repairPlanLabel(chosen.repairPlan)}. <a href={`#defect-${chosen.number}`}>See it in the list</a>
                    </p>
                  ) : null}
                </div>
              </figcaption>
            </figure>
          );
        })}
      </div>
    </div>
  );
}

/** The list by zone: reads completely without the photos. */
interface DefectListProps {
  snapshot: PublicSnapshot;
  selected: number | null;
  onShowPin: (n: number) => void;
  locale: string;
}

function DefectList({ snapshot, selected, onShowPin, locale }: DefectListProps) {
  const groups = zoneOrder(snapshot)
    .map((zone) => ({ zone, items: snapshot.defects.filter((d) => d.zone === zone).sort((a, b) => a.number - b.number) }))
    .filter((g) => g.items.length > 0);
  return (
    <div className="fr-list min-w-0">
      <h3 className="text-xl font-bold">Item by item</h3>
      <div className="mt-4 flex flex-col gap-6">
        {groups.map((g) => (
          <div key={g.zone} className="fr-zone">
            <h4 className="text-lg font-bold">
              {zoneLabel(g.zone)} <span className="font-normal text-ink-soft">· {count(g.items.length, "item", "items", locale)}</span>
            </h4>
            {/* Named through hidden text rather than aria-label, which validators flag on a list without a role. */}
            <span id={`items-${g.zone}`} hidden>
              Items in {zoneLabel(g.zone)}
            </span>
            <ol aria-labelledby={`items-${g.zone}`} className="mt-2 flex flex-col gap-2">
              {g.items.map((d) => (
                <DefectRow key={d.number} defect={d} selected={selected === d.number} onShowPin={d.pin ? () => onShowPin(d.number) : null} locale={locale} />
              ))}
            </ol>
          </div>
        ))}
      </div>
    </div>
  );
}

function DefectRow({ defect: d, selected, onShowPin, locale }: { defect: PublicDefect; selected: boolean; onShowPin: (() => void) | null; locale: string }) {
  return (
    <li
      id={`defect-${d.number}`}
      tabIndex={-1}
      className={`fr-defect-row flex scroll-mt-4 gap-3 rounded-md border p-3 ${selected ? "border-signal bg-signal-wash outline-2 outline-signal" : "border-line bg-paper-raised"}`}
      data-selected={selected || undefined}
    >
      {onShowPin ? (
        <button type="button" onClick={onShowPin} className="self-start rounded-md" aria-label={`${d.number}: show this item's pin on the photo`}>
          <DefectNumber defect={d} />
        </button>
      ) : (
        <span className="self-start">
          {/* A plain span may not carry a name (aria-label); the word is read before the number instead. */}
          <span className="sr-only">Item </span>
          <DefectNumber defect={d} />
        </span>
      )}
      <div className="min-w-0 flex-1">
        <p className="font-bold">
          {/* On paper the zone headings are left off and each row names its zone. */}
          <span className="hidden print:inline">{zoneLabel(d.zone)}: </span>
          {headline(d, locale)}
        </p>
        {d.safetyRelevant ? (
          <p className="font-bold text-brick">
            {d.repairPlan === "repaired_before_sale" ? "Safety item: repaired before sale." : "Affects safety: see the cautions below."}
          </p>
        ) : null}
        {d.note ? <p>{d.note}</p> : null}
        <p className="text-sm">
          Repair plan: <strong>{repairPlanLabel(d.repairPlan)}</strong>
          {!d.pin ? " · not on a photo" : ""}
        </p>
      </div>
      {d.closeup ? (
        <img
          src={d.closeup}
          width={480}
          height={480}
          loading="lazy"
          decoding="async"
          alt={`Close-up of item ${d.number}, the ${defectName(d)}`}
          className="fr-closeup size-20 shrink-0 self-start rounded-md border border-line bg-paper-sunk object-cover sm:size-24"
        />
      ) : null}
    </li>
  );
}

/** Zones checked with nothing found, and zones not checked, said plainly. */
function ZoneSummary({ snapshot }: { snapshot: PublicSnapshot }) {
  const state = new Map(snapshot.zones.map((z) => [z.zone, z.state]));
  const withDefects = new Set(snapshot.defects.map((d) => d.zone));
  const order = zoneOrder(snapshot);
  const clear = order.filter((z) => state.get(z) === "nothing_found" && !withDefects.has(z));
  const unchecked = order.filter((z) => (state.get(z) ?? "unchecked") === "unchecked" && !withDefects.has(z));
  return (
    <div className="fr-zones mt-6 flex flex-col gap-3">
      {clear.length ? (
        <p>
          <strong>Checked, nothing found:</strong> {clear.map(zoneLabel).join(", ")}.
        </p>
      ) : null}
      {unchecked.length ? (
        <p className="rounded-md border-l-4 border-ochre bg-ochre-wash px-3 py-2">
          <strong>Not checked at this inspection:</strong> {unchecked.map(zoneLabel).join(", ")}. We say nothing about {unchecked.length === 1 ? "this part" : "these parts"}; ask us,
          or have your own inspector look.
        </p>
      ) : null}
    </div>
  );
}

/** Every zone of the walk-around in its usual order (one the report does not mention was not checked), then any other the report names. */
function zoneOrder(snapshot: PublicSnapshot): string[] {
  const named = new Set<string>([...snapshot.zones.map((z) => z.zone), ...snapshot.defects.map((d) => d.zone)]);
  return [...ZONES, ...[...named].filter((z) => !(ZONES as readonly string[]).includes(z))];
}
