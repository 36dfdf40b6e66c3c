import type { ReactNode } from "react";
import type { TyreAssessment } from "../../../../shared/domain/tyre-assessment.ts";
import { parseDotDate } from "../../../../shared/domain/tyre-dot.ts";
import { formatNumber, formatPercent, formatTreadDepth, THIN_SPACE } from "../../../../shared/domain/display.ts";
import type { TyreRules } from "../form-model.ts";

const WHERE: Record<string, string> = { inner: "inner", centre: "centre", outer: "outer" };
const CONSTRUCTION: Record<string, string> = { radial: "radial", diagonal: "diagonal (cross-ply)", bias_belted: "bias-belted" };

/** A figure with its unit never splits across lines (the formatter puts a thin space between them). */
const Nb = ({ children }: { children: ReactNode }) => <span className="whitespace-nowrap">{children}</span>;

/** Parts of one line, each kept whole, the separator staying with the part before it. */
const Parts = ({ parts }: { parts: ReactNode[] }) => (
  <>
    {parts.map((p, i) => (
      <span key={i}>
        <Nb>
          {p}
          {i < parts.length - 1 ? " ·" : ""}
        </Nb>
        {i < parts.length - 1 ? " " : ""}
      </span>
    ))}
  </>
);

function Row({ label, children, tone = "plain", small = false }: { label: string; children: ReactNode; tone?: "plain" | "fail" | "advise" | "faint"; small?: boolean }) {
  const box = {
    plain: "",
    faint: "text-ink-soft",
    fail: "rounded-md border-l-4 border-brick bg-brick-wash px-3 py-2 text-ink",
    advise: "rounded-md border-l-4 border-ochre bg-ochre-wash px-3 py-2 text-ink",
  }[tone];
  return (
    <div className={`flex flex-col ${box}`}>
      <dt className="text-xs font-bold uppercase tracking-wide text-ink-soft">{label}</dt>
      <dd className={`figures ${small ? "text-sm" : "text-base"}`}>{children}</dd>
    </div>
  );
}

/** What the server will work out from this tyre, shown as it is typed, with the same shared functions. */
export function TyreFigures({ assessment: a, dotCode, rules, locale }: { assessment: TyreAssessment; dotCode: string; rules: TyreRules; locale: string }) {
  const o = { locale };
  const mm = (v: number) => <Nb>{formatTreadDepth(v, o)}</Nb>;
  const min = mm(rules.legalMinTreadMm);
  const rows: ReactNode[] = [];

  if (!a.tread) {
    rows.push(
      <Row key="tread" label="Least tread" tone="faint">
        Type the depths to compare the shallowest with the {min} minimum.
      </Row>,
    );
  } else if (a.tread.verdict === "fail") {
    rows.push(
      <Row key="tread" label="Least tread" tone="fail">
        <strong className="text-brick">Below the legal minimum.</strong> Least {mm(a.tread.leastMm)} ({WHERE[a.tread.leastPosition]}), the minimum is {min}. Replace this tyre before the
        vehicle is driven on the road.
      </Row>,
    );
  } else {
    const margin = a.tread.marginMm === 0 ? <>at the {min} minimum, which passes; plan to replace it</> : <>above the {min} minimum</>;
    rows.push(
      <Row key="tread" label="Least tread">
        <strong>Least {mm(a.tread.leastMm)}</strong> ({WHERE[a.tread.leastPosition]}) — {margin}
      </Row>,
    );
  }
  if (a.tread?.missing.length) {
    rows.push(
      <Row key="missing" label="Not measured" tone="faint" small>
        {a.tread.missing.map((p) => WHERE[p]).join(", ")}: the least of the others decides.
      </Row>,
    );
  }
  if (a.remainingPercent != null) {
    rows.push(
      <Row key="remaining" label="Remaining tread">
        <strong><Nb>{formatPercent(a.remainingPercent, o)}</Nb></strong> <span className="text-sm">of the usable depth, new {mm(rules.newTyreTreadMm)} down to {min}</span>
      </Row>,
    );
  }

  if (a.size) {
    const s = a.size;
    const load = s.loadKg != null ? `${formatNumber(s.loadKg, o)}${THIN_SPACE}kg` : null;
    const loadDual = s.loadKgDual != null ? `${formatNumber(s.loadKgDual, o)}${THIN_SPACE}kg` : null;
    rows.push(
      <Row key="size" label="Size decoded" small>
        <Parts
          parts={[
            `${formatNumber(s.widthMm, o)}${THIN_SPACE}mm wide`,
            `${formatNumber(s.aspectRatio, o)}${THIN_SPACE}% profile`,
            `${formatNumber(s.rimInches, { ...o, fractionDigits: Number.isInteger(s.rimInches) ? 0 : 1 })}${THIN_SPACE}in rim`,
            CONSTRUCTION[s.construction],
          ]}
        />
        <br />
        Overall diameter <Nb>{formatNumber(s.overallDiameterMm, { ...o, fractionDigits: 1 })}{THIN_SPACE}mm</Nb>
        {s.loadIndex != null ? (
          <>
            <br />
            Load {s.loadIndex}
            {s.loadIndexDual != null ? `/${s.loadIndexDual}` : ""} → <Nb>{load ?? "not in the table"}</Nb>
            {loadDual ? ` / ${loadDual}` : ""} per tyre
          </>
        ) : null}
        {s.speedSymbol ? (
          <>
            <br />
            Speed {s.speedSymbol} → {s.speedKmh != null ? <>up to <Nb>{formatNumber(s.speedKmh, o)}{THIN_SPACE}km/h</Nb></> : "not in the table"}
          </>
        ) : null}
        {s.notes.length ? <span className="mt-1 block text-xs text-ink-soft">{s.notes.map((n) => n.message).join(" ")}</span> : null}
      </Row>,
    );
  } else if (a.sizeError) {
    rows.push(
      <Row key="size" label="Size" tone="faint" small>
        {a.sizeError} It is saved as written but not decoded.
      </Row>,
    );
  }

  const code = dotCode.trim();
  if (code) {
    const dot = parseDotDate(code);
    const made = dot.kind === "wwyy" ? `made in week ${dot.week} of ${dot.year}` : dot.kind === "pre2000" ? `made in week ${dot.week} of a year ending in ${dot.yearLastDigit}, before 2000` : null;
    if (dot.kind === "invalid") {
      rows.push(
        <Row key="age" label="Age" tone="faint">
          {dot.reason === "week_out_of_range" ? "The first two digits are the week, 01 to 53; check the code on the sidewall." : "The last 4 digits of the DOT number, like 2319 (week 23 of 2019)."}
        </Row>,
      );
    } else if (a.ageYears == null) {
      rows.push(
        <Row key="age" label="Age" tone="faint">
          {made ? `${made[0].toUpperCase()}${made.slice(1)}, after the measuring date. Check the code and the date.` : "Set the measuring date to work out the age."}
        </Row>,
      );
    } else {
      const years = `${a.ageUncertain ? "at least " : ""}${formatNumber(a.ageYears, o)} year${a.ageYears === 1 ? "" : "s"} old`;
      if (a.ageAdvisory === "strong") {
        rows.push(
          <Row key="age" label="Age" tone="advise">
            <strong>Strong advisory: {years}</strong> ({made}). Road-safety guidance such as Ontario's Driver's Handbook says tyres
            should not be older than 10 years: replace it, or have it inspected before sale, whatever the tread.
          </Row>,
        );
      } else if (a.ageAdvisory === "advise") {
        rows.push(
          <Row key="age" label="Age" tone="advise">
            <strong>Advise: {years}</strong> ({made}). Vehicle makers commonly advise replacing tyres from 6 years; have it checked and tell the buyer.
          </Row>,
        );
      } else {
        rows.push(
          <Row key="age" label="Age">
            <strong>{years}</strong> ({made})
          </Row>,
        );
      }
      if (a.ageUncertain) {
        rows.push(
          <Row key="decade" label="Date code" tone="faint">
            A 3-digit code leaves the decade open; the age shown is the least it can be.
          </Row>,
        );
      }
    }
  }

  return (
    <dl className="flex flex-col gap-3 rounded-md border border-dashed border-line-strong bg-paper p-3" aria-label="Worked out from these readings" aria-live="polite">
      {rows}
    </dl>
  );
}
