import { useMemo, useRef, useState, type FormEvent, type ReactNode } from "react";
import { CHECK_ITEMS, TYRE_POSITIONS, type CheckItem, type TyrePosition } from "../../../../shared/constants/evidence.ts";
import { isDefectCaution, NOT_A_CERTIFICATE } from "../../../../shared/domain/cautions.ts";
import { formatTreadDepth } from "../../../../shared/domain/display.ts";
import type { Role } from "../../../../shared/constants/roles.ts";
import { can } from "../../../../shared/permissions.ts";
import { dealershipDay } from "../../../../shared/domain/calendar.ts";
import { isApiError } from "../../../lib/api-client.ts";
import type { VehicleEvidence } from "../../vehicles/api/evidence.ts";
import type { DealershipView } from "../../settings/api/dealership.ts";
import { useReloadChecks, useSaveChecks, useSaveTyres } from "../api/checks.ts";
import {
  checkErrorKeys, checksDirty, checksFormFrom, liveCautions, tyreErrorKeys, tyresDirty, tyresFormFrom, validateChecks, validateTyres,
  type CheckForm, type FieldErrors, type TyreField,
} from "../form-model.ts";
import { Button } from "../../../components/ui/Button.tsx";
import { Notice } from "../../../components/feedback/Notice.tsx";
import { useUnsavedWarning } from "../../../components/form/use-unsaved-warning.ts";
import { CautionsPanel } from "./CautionsPanel.tsx";
import { CheckRow } from "./CheckRow.tsx";
import { TyreCard } from "./TyreCard.tsx";
import { Measure } from "./inputs.tsx";
import { useSavedPart } from "./use-saved-part.ts";

const ROAD: readonly TyrePosition[] = TYRE_POSITIONS.filter((p) => p !== "spare");

interface Props {
  vehicle: { id: number; evidence: VehicleEvidence };
  dealership: DealershipView;
  role: Role;
}

const messageOf = (e: unknown) => (e instanceof Error ? e.message : "Something went wrong; nothing you typed has been lost.");

/** Tyres and checks, phone first: what is typed stays in the form until it is saved or the person chooses theirs. */
export function ChecksScreen({ vehicle, dealership, role }: Props) {
  const canEdit = can(role, "evidence.write");
  const today = dealershipDay(dealership.timeZone);
  const { legalMinTreadMm, newTyreTreadMm } = dealership;
  const rules = useMemo(() => ({ legalMinTreadMm, newTyreTreadMm }), [legalMinTreadMm, newTyreTreadMm]);
  const locale = dealership.locale;
  const ev = vehicle.evidence;

  const [errors, setErrors] = useState<FieldErrors>({});
  const [conflict, setConflict] = useState({ tyres: false, checks: false });
  // What was last saved (the base), and what is typed, for each part.
  const tyresPart = useSavedPart(ev.tyres, tyresFormFrom, tyresDirty, { today, held: conflict.tyres });
  const checksPart = useSavedPart(ev.checks, checksFormFrom, checksDirty, { today, held: conflict.checks });
  const { form: tyres, edit: setTyres } = tyresPart;
  const { form: checks, edit: setChecks, base: checksBase, baseForm: checksBaseForm } = checksPart;
  const [problem, setProblem] = useState<string | null>(null);
  const [note, setNote] = useState<string | null>(null);
  const noticesRef = useRef<HTMLDivElement>(null);

  const saveTyres = useSaveTyres(vehicle.id);
  const saveChecks = useSaveChecks(vehicle.id);
  const reload = useReloadChecks(vehicle.id);
  const busy = saveTyres.isPending || saveChecks.isPending;

  const tDirty = tyresPart.dirty;
  const cDirty = checksPart.dirty;
  const dirty = tDirty || cDirty;
  const live = useMemo(() => liveCautions(tyres, checks, rules), [tyres, checks, rules]);

  useUnsavedWarning(dirty);

  function touched() {
    setNote(null);
  }
  function setTyre(position: TyrePosition, field: TyreField, value: string) {
    touched();
    setTyres((f) => ({ ...f, tyres: { ...f.tyres, [position]: { ...f.tyres[position], [field]: value } } }));
  }
  function setCheck(item: CheckItem, value: CheckForm) {
    touched();
    setChecks((f) => ({ ...f, [item]: value }));
  }

  const showNotices = () => requestAnimationFrame(() => noticesRef.current?.scrollIntoView({ block: "start", behavior: "smooth" }));
  const showFirstError = () =>
    requestAnimationFrame(() => {
      const el = document.querySelector<HTMLElement>('form[aria-label="Tyres and checks"] [aria-invalid="true"]');
      el?.scrollIntoView({ block: "center" });
      el?.focus({ preventScroll: true });
    });

  const showProblem = (err: unknown) => setProblem(messageOf(err));

  async function save() {
    if (!canEdit || busy || !dirty) return;
    setProblem(null);
    setNote(null);
    const day = dealershipDay(dealership.timeZone);
    const sentTyres = tyres;
    const sentChecks = checks;
    // The same schemas the server uses, so mistakes show before anything is sent.
    const t = tDirty ? validateTyres(sentTyres, tyresPart.base.version, day) : null;
    const c = cDirty ? validateChecks(sentChecks, checksBase.version) : null;
    const found = { ...(t?.errors ?? {}), ...(c?.errors ?? {}) };
    setErrors(found);
    if (Object.keys(found).length) return showFirstError();

    const saved: string[] = [];
    const stale = { ...conflict };
    let fieldErrors: FieldErrors = {};
    let other: string | null = null;
    /** Sends one part; a refusal is sorted into a conflict, messages on fields, or a problem for the top. */
    const send = async (part: "tyres" | "checks", what: string, run: () => Promise<void>, toKeys: (f: Record<string, string>) => FieldErrors) => {
      try {
        await run();
        stale[part] = false;
        saved.push(what);
      } catch (err) {
        if (isApiError(err) && err.code === "stale_version") stale[part] = true;
        else if (isApiError(err) && err.status === 400 && Object.keys(err.fields).length) fieldErrors = { ...fieldErrors, ...toKeys(err.fields) };
        else other = messageOf(err);
      }
    };
    // One after the other, so the second answer carries the cautions of both.
    if (t) {
      const adopt = async () => tyresPart.adopt((await saveTyres.mutateAsync(t.body)).tyres, sentTyres, day);
      await send("tyres", "tyre readings", adopt, (f) => tyreErrorKeys(f, t.positions));
    }
    if (c) {
      const adopt = async () => checksPart.adopt((await saveChecks.mutateAsync(c.body)).checks, sentChecks, day);
      await send("checks", "checks", adopt, (f) => checkErrorKeys(f, c.items));
    }
    setConflict(stale);
    setErrors(fieldErrors);
    setProblem(other);
    if (saved.length) setNote(`Saved the ${saved.join(" and the ")}.`);
    if (stale.tyres || stale.checks || other) showNotices();
    else if (Object.keys(fieldErrors).length) showFirstError();
  }

  /** Their version replaces what was typed in the part that clashed. */
  async function loadTheirs() {
    const data = await reload.mutateAsync();
    if (conflict.tyres) tyresPart.takeTheirs(data.tyres);
    if (conflict.checks) checksPart.takeTheirs(data.checks);
    setConflict({ tyres: false, checks: false });
    setErrors({});
    setNote("Their latest readings and checks are loaded.");
  }
  /** Theirs become the base; what was typed stays in the form, ready to save over them. */
  async function keepMine() {
    const data = await reload.mutateAsync();
    if (conflict.tyres) tyresPart.keepMine(data.tyres);
    if (conflict.checks) checksPart.keepMine(data.checks);
    setConflict({ tyres: false, checks: false });
    setNote("Your values are kept. Save to replace theirs with them.");
  }
  // The handlers' promises are dropped on purpose: whatever goes wrong is shown at the top, the form kept as it is.
  const submit = (e: FormEvent) => {
    e.preventDefault();
    void save().catch(showProblem);
  };

  const errorCount = Object.keys(errors).length;
  const inConflict = conflict.tyres || conflict.checks;
  const what = tDirty && cDirty ? "tyres and checks" : tDirty ? "tyres" : cDirty ? "checks" : "";
  const status = busy
    ? "Saving…"
    : errorCount
      ? `${errorCount} field${errorCount === 1 ? " needs" : "s need"} attention; nothing with a mistake was saved.`
      : inConflict
        ? "Not saved: someone else saved first. Choose theirs or yours at the top."
        : note ?? (dirty ? `Unsaved ${what}.` : "Everything on this screen is saved.");
  const sparePosition: TyrePosition = "spare";
  const answered = CHECK_ITEMS.filter((i) => checks[i].result !== "").length;
  const measuredRoad = ROAD.filter((p) => tyres.tyres[p].treadInnerMm || tyres.tyres[p].treadCentreMm || tyres.tyres[p].treadOuterMm).length;

  return (
    <form onSubmit={submit} noValidate aria-label="Tyres and checks" className="flex flex-col gap-6">
      <div ref={noticesRef} className="flex scroll-mt-4 flex-col gap-3 empty:hidden">
        {!canEdit ? <Notice tone="info" title="Your role can read the tyres and checks; workshop, sales and admin record them." /> : null}
        {inConflict ? (
          <Notice tone="caution" title="Someone saved these readings after you opened them">
            <p>
              {conflict.tyres && conflict.checks ? "The tyre readings and the checks were" : conflict.tyres ? "The tyre readings were" : "The checks were"} saved by someone
              else. Yours were not saved and are still in the form until you choose.
            </p>
            <div className="mt-3 flex flex-col gap-2 sm:flex-row">
              <Button type="button" tone="primary" busy={reload.isPending} onClick={() => void loadTheirs().catch(showProblem)}>
                Load theirs
              </Button>
              <Button type="button" tone="secondary" disabled={reload.isPending} onClick={() => void keepMine().catch(showProblem)}>
                Keep mine and save over theirs
              </Button>
            </div>
            <p className="mt-2 text-xs text-ink-soft">“Load theirs” replaces what you typed in that part.</p>
          </Notice>
        ) : null}
        {problem ? <Notice tone="danger" title={problem}>Nothing you typed has been lost; try again.</Notice> : null}
      </div>

      {/* Typing here cannot clear a defect's caution, so it stays in the "as typed" list too. */}
      <CautionsPanel saved={ev.cautions} live={[...live, ...ev.cautions.filter(isDefectCaution)]} editing={dirty} />

      <fieldset disabled={!canEdit} className="m-0 flex min-w-0 flex-col gap-8 border-0 p-0">
        <Part
          id="tyres-heading"
          title="Tyres"
          className="gap-4"
          intro={
            <>
              Measure in the main grooves at three points across each tyre; the shallowest decides.
              Legal minimum here {formatTreadDepth(rules.legalMinTreadMm, { locale })} (set in Settings; local law decides how it
              is measured). {measuredRoad} of 4 road tyres measured.
            </>
          }
        >
          <div className="max-w-xs">
            <Measure
              label="Measured on"
              type="date"
              max={today}
              value={tyres.measuredOn}
              error={errors.measuredOn}
              hint="Tyre ages are worked out to this day."
              onValue={(v) => {
                touched();
                setTyres((f) => ({ ...f, measuredOn: v }));
              }}
            />
          </div>
          {errors["tyres._"] ? <p className="text-sm font-bold text-brick">{errors["tyres._"]}</p> : null}
          <div className="grid gap-4 lg:grid-cols-2">
            {ROAD.map((p) => (
              <TyreCard
                key={p}
                position={p}
                value={tyres.tyres[p]}
                measuredOn={tyres.measuredOn}
                rules={rules}
                locale={locale}
                errors={errors}
                copySize={p === "front_left" ? undefined : tyres.tyres.front_left.sizeDesignation}
                onChange={(f, v) => setTyre(p, f, v)}
              />
            ))}
            {tyres.spare ? (
              <TyreCard
                position={sparePosition}
                value={tyres.tyres.spare}
                measuredOn={tyres.measuredOn}
                rules={rules}
                locale={locale}
                errors={errors}
                copySize={tyres.tyres.front_left.sizeDesignation}
                onChange={(f, v) => setTyre(sparePosition, f, v)}
                action={
                  <button
                    type="button"
                    aria-expanded="true"
                    className="min-h-11 rounded-md border border-line-strong px-3 text-sm font-bold text-ink hover:border-ink-soft"
                    onClick={() => {
                      touched();
                      setTyres((f) => ({ ...f, spare: false }));
                    }}
                  >
                    No spare / not measured
                  </button>
                }
              />
            ) : (
              <section aria-labelledby="spare-heading" className="flex flex-wrap items-center justify-between gap-3 rounded-lg border border-dashed border-line-strong bg-paper-raised p-4">
                <div>
                  <h3 id="spare-heading" className="text-lg font-bold">
                    Spare
                  </h3>
                  <p className="text-sm text-ink-soft">
                    No spare / not measured.{" "}
                    {Object.values(tyres.tyres.spare).some((v) => v.trim()) ? "The values typed are kept here but not saved." : "Optional; record it when there is one."}
                  </p>
                </div>
                <Button
                  type="button"
                  tone="secondary"
                  aria-expanded="false"
                  onClick={() => {
                    touched();
                    setTyres((f) => ({ ...f, spare: true }));
                  }}
                >
                  Measure the spare
                </Button>
              </section>
            )}
          </div>
        </Part>

        <Part
          id="checks-heading"
          title="Safety and function checks"
          className="gap-3"
          intro={
            <>
              {answered} of {CHECK_ITEMS.length} checked. A Fail on a safety item blocks publishing until it is repaired and checked
              again. Unanswered checks are not saved.
            </>
          }
        >
          {errors["checks._"] ? <p className="text-sm font-bold text-brick">{errors["checks._"]}</p> : null}
          <div className="rounded-lg border border-line bg-paper-raised px-4">
            {CHECK_ITEMS.map((item) => {
              const savedResult = checksBase.results.find((r) => r.item === item);
              const unchanged = JSON.stringify(checks[item]) === JSON.stringify(checksBaseForm[item]);
              return (
                <CheckRow
                  key={item}
                  item={item}
                  value={checks[item]}
                  saved={savedResult && unchanged ? { checkedOn: savedResult.checkedOn, checkedBy: savedResult.checkedBy } : undefined}
                  errors={errors}
                  onChange={(v) => setCheck(item, v)}
                />
              );
            })}
          </div>
          <p className="rounded-md border border-line bg-paper-sunk px-4 py-3 text-sm" data-testid="not-a-certificate">
            {NOT_A_CERTIFICATE}
          </p>
        </Part>
      </fieldset>

      {canEdit ? (
        <div className="sticky bottom-0 z-10 -mx-5 flex flex-col gap-2 border-t-2 border-line-strong bg-paper px-5 pt-3 pb-[max(0.75rem,env(safe-area-inset-bottom))] sm:flex-row-reverse sm:items-center sm:justify-end sm:gap-4">
          <p className={`text-sm ${errorCount || inConflict ? "font-bold text-brick" : "text-ink-soft"}`} aria-live="polite" data-testid="save-status">
            {status}
          </p>
          <Button type="submit" tone={dirty || busy ? "primary" : "secondary"} busy={busy} disabled={!dirty} className="min-h-12 w-full text-lg sm:w-auto">
            {what ? `Save ${what}` : "Saved"}
          </Button>
        </div>
      ) : null}
    </form>
  );
}

/** One part of the form: its heading and what to do, then its fields. */
function Part({ id, title, intro, className, children }: { id: string; title: string; intro: ReactNode; className: string; children: ReactNode }) {
  return (
    <section aria-labelledby={id} className={`flex flex-col ${className}`}>
      <div>
        <h2 id={id} className="text-xl font-bold">
          {title}
        </h2>
        <p className="mt-1 text-sm text-ink-soft">{intro}</p>
      </div>
      {children}
    </section>
  );
}
