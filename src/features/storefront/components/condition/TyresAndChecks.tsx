import type { PublicSnapshot, PublicTyre } from "../../../../../shared/schemas/public.ts";
import { formatNumber, formatPercent, formatTreadDepth, withUnit } from "../../../../../shared/domain/display.ts";
import { TYRE_POSITIONS } from "../../../../../shared/constants/evidence.ts";
import { TYRE_AGE_ADVISE_YEARS, TYRE_AGE_STRONG_YEARS } from "../../../../../shared/domain/tyre-tread.ts";
import { checkResultLabel, dateText, tyrePositionLabel } from "../../format.ts";
import { Qty } from "../Figure.tsx";
import { Section } from "./Section.tsx";

/** Tyres measured and the safety and function checks, every result in words. */
export function TyresAndChecks({ snapshot, locale }: { snapshot: PublicSnapshot; locale: string }) {
  const { tyres, checks } = snapshot;
  const measured = dateText(tyres.measuredOn, locale);
  const min = formatTreadDepth(tyres.legalMinTreadMm, { locale });
  const order = (p: string) => {
    const i = (TYRE_POSITIONS as readonly string[]).indexOf(p);
    return i < 0 ? 99 : i;
  };
  const readings = [...tyres.readings].sort((a, b) => order(a.position) - order(b.position));
  const checkDates = [...new Set(checks.map((c) => c.checkedOn).filter(Boolean))];
  return (
    <Section id="tyres-checks" title="Tyres and checks">
      <div className="fr-tc-grid grid grid-cols-1 gap-8 lg:grid-cols-2">
        <div className="fr-tyres min-w-0">
          <h3 className="text-xl font-bold">Tyres</h3>
          <p className="mt-1">
            {measured ? <>Measured on {measured}. </> : null}
            The legal minimum tread depth where we sell is <Qty text={min} />, at the shallowest point.
            <span className="print:hidden"> The tread figures are for information: local law and a licensed inspector decide.</span>
          </p>
          {readings.length === 0 ? (
            <p className="mt-3 rounded-md border-l-4 border-ochre bg-ochre-wash px-3 py-2">The tyres were not measured for this report. Ask us, or have them checked.</p>
          ) : (
            <>
              <ul className="fr-tyre-grid mt-4 grid gap-3 sm:grid-cols-2 print:hidden">
                {readings.map((t) => (
                  <TyreCard key={t.position} tyre={t} min={min} locale={locale} />
                ))}
              </ul>
              <TyreTable readings={readings} min={min} locale={locale} />
            </>
          )}
        </div>
        <div className="fr-checks min-w-0">
          <h3 className="text-xl font-bold">Checks</h3>
          <p className="mt-1">
            {checkDates.length === 1 ? <>Run on {dateText(checkDates[0], locale)}. </> : null}
            <span className="print:hidden">Each check is a pass, an advise (works, but needs attention soon) or a fail.</span>
          </p>
          {checks.length === 0 ? (
            <p className="mt-3 rounded-md border-l-4 border-ochre bg-ochre-wash px-3 py-2">No checks were recorded for this report. Ask us, or have the vehicle inspected.</p>
          ) : (
            <ul className="mt-4 flex flex-col divide-y divide-line rounded-lg border border-line bg-paper-raised">
              {checks.map((c) => (
                <li key={c.item} className={`fr-check flex flex-col gap-1 px-4 py-3 ${c.result === "fail" ? "border-l-4 border-l-brick bg-brick-wash" : c.result === "advise" ? "border-l-4 border-l-ochre bg-ochre-wash" : ""}`}>
                  <p className="flex flex-wrap items-baseline justify-between gap-x-3">
                    <span className="font-bold">{c.label}</span>
                    <span className={`font-bold ${c.result === "fail" ? "text-brick" : ""}`}>{checkResultLabel(c.result)}</span>
                  </p>
                  {c.note ? <p className="text-sm">{c.note}</p> : null}
                  {checkDates.length > 1 && c.checkedOn ? <p className="text-sm text-ink-soft">Checked on {dateText(c.checkedOn, locale)}</p> : null}
                </li>
              ))}
            </ul>
          )}
        </div>
      </div>
    </Section>
  );
}

function TyreCard({ tyre: t, min, locale }: { tyre: PublicTyre; min: string | null; locale: string }) {
  const least = formatTreadDepth(t.leastTreadMm, { locale });
  const remaining = formatPercent(t.remainingPercent, { locale });
  const fail = t.treadVerdict === "fail";
  const years = t.ageYears !== null ? `${formatNumber(t.ageYears, { locale })} ${t.ageYears === 1 ? "year" : "years"} old` : null;
  return (
    <li className={`fr-tyre rounded-lg border p-4 ${fail ? "border-2 border-brick bg-brick-wash" : "border-line bg-paper-raised"}`}>
      <h4 className="font-bold">{tyrePositionLabel(t.position)}</h4>
      <dl className="mt-2 flex flex-col gap-2 text-base">
        <div>
          <dt className="text-sm text-ink-soft">Least tread</dt>
          <dd>
            {least ? (
              <>
                <strong>
                  <Qty text={least} />
                </strong>{" "}
                {fail ? (
                  <strong className="text-brick">
                    below the <Qty text={min} /> legal minimum. Replace it before the vehicle is driven on the road.
                  </strong>
                ) : t.treadVerdict === null ? null : least === min ? (
                  <>at the legal minimum; plan to replace it.</>
                ) : (
                  <>above the <Qty text={min} /> legal minimum</>
                )}
              </>
            ) : (
              "Not measured"
            )}
          </dd>
        </div>
        {remaining ? (
          <div>
            <dt className="text-sm text-ink-soft">Tread left</dt>
            <dd>
              <strong>
                <Qty text={remaining} />
              </strong>{" "}
              of the usable depth
            </dd>
          </div>
        ) : null}
        <div>
          <dt className="text-sm text-ink-soft">Age</dt>
          <dd>
            {years === null ? (
              "Not known"
            ) : t.ageAdvisory === "strong" ? (
              <>
                <strong>{years}.</strong> Many makers advise replacing tyres at {TYRE_AGE_STRONG_YEARS} years whatever the tread; have it inspected or replaced.
              </>
            ) : t.ageAdvisory === "advise" ? (
              <>
                <strong>{years}.</strong> Makers commonly advise replacing tyres from {TYRE_AGE_ADVISE_YEARS} years; have it checked.
              </>
            ) : (
              <strong>{years}</strong>
            )}
          </dd>
        </div>
        {t.size ? (
          <div>
            <dt className="text-sm text-ink-soft">Size</dt>
            <dd>
              <strong className="figures">{t.size}</strong>
              {t.loadKg !== null || t.speedKmh !== null ? (
                <span className="block text-sm">
                  {[
                    t.loadKg !== null ? <>carries up to <Qty key="l" text={withUnit(t.loadKg, "kg", { locale })} /></> : null,
                    t.speedKmh !== null ? <>rated to <Qty key="s" text={withUnit(t.speedKmh, "km/h", { locale })} /></> : null,
                  ]
                    .filter(Boolean)
                    .map((part, i) => (
                      <span key={i}>
                        {i > 0 ? ", " : ""}
                        {part}
                      </span>
                    ))}
                </span>
              ) : null}
            </dd>
          </div>
        ) : null}
      </dl>
    </li>
  );
}

/** On paper the same readings as one compact table (the cards above are for screens). */
function TyreTable({ readings, min, locale }: { readings: PublicTyre[]; min: string | null; locale: string }) {
  return (
    <table className="fr-tyre-table mt-2 hidden w-full print:table">
      <thead>
        <tr>
          <th scope="col">Tyre</th>
          <th scope="col">Least tread</th>
          <th scope="col">Tread left</th>
          <th scope="col">Age</th>
          <th scope="col">Size</th>
        </tr>
      </thead>
      <tbody>
        {readings.map((t) => {
          const least = formatTreadDepth(t.leastTreadMm, { locale });
          return (
            <tr key={t.position}>
              <th scope="row">{tyrePositionLabel(t.position)}</th>
              <td>
                <Qty text={least} missing="Not measured" />
                {least && t.treadVerdict === "fail" ? (
                  <strong>
                    , below the <Qty text={min} /> legal minimum: replace before road use
                  </strong>
                ) : least && t.treadVerdict === "pass" ? (
                  least === min ? ", at the legal minimum" : ", above the minimum"
                ) : null}
              </td>
              <td>
                <Qty text={formatPercent(t.remainingPercent, { locale })} />
              </td>
              <td>
                {t.ageYears === null ? "Not known" : `${formatNumber(t.ageYears, { locale })} ${t.ageYears === 1 ? "year" : "years"}`}
                {t.ageAdvisory === "strong" ? <strong>, replace or have it inspected</strong> : t.ageAdvisory === "advise" ? <strong>, have it checked</strong> : null}
              </td>
              <td>{t.size ?? "—"}</td>
            </tr>
          );
        })}
      </tbody>
    </table>
  );
}
