export const formatDay = (ymd: string) => {
  const [y, m, d] = ymd.split("-").map(Number);
  return new Date(y, m - 1, d).toLocaleDateString(undefined, { day: "numeric", month: "short", year: "numeric" });
};

export const formatWhen = (iso: string) => new Date(iso).toLocaleString(undefined, { dateStyle: "medium", timeStyle: "short" });

export const ageWords = (days: number) => (days <= 0 ? "Today" : days === 1 ? "1 day" : `${days} days`);

/**
 * Follow-up state in words: colour may add to it, never replace it. `today` is the dealership's day (useDealershipDay),
 * the one the server's "overdue" filter uses; until it is known the date is shown without a verdict.
 */
export function followUpState(followUpOn: string | null, today: string | null): { word: "overdue" | "today" | "later" | "none"; text: string } {
  if (!followUpOn) return { word: "none", text: "None set" };
  if (!today) return { word: "later", text: formatDay(followUpOn) };
  if (followUpOn < today) return { word: "overdue", text: `${formatDay(followUpOn)}, overdue` };
  if (followUpOn === today) return { word: "today", text: `${formatDay(followUpOn)}, today` };
  return { word: "later", text: formatDay(followUpOn) };
}

export const SOURCE_LABELS: Record<string, string> = { condition_page: "Condition page enquiry form" };

export const MAIL_STATUS_WORDS: Record<"queued" | "sent" | "failed", string> = {
  queued: "Queued, not sent yet",
  sent: "Sent",
  failed: "Failed to send: see Mail",
};
