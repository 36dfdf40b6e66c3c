/** A lead's path, in our own words. */
export const LEAD_STATUSES = ["waiting", "talking", "test_drive", "offer", "won", "lost"] as const;
export type LeadStatus = (typeof LEAD_STATUSES)[number];
export const LEAD_STATUS_LABELS: Record<LeadStatus, string> = {
  waiting: "Waiting for a reply",
  talking: "In conversation",
  test_drive: "Test drive booked",
  offer: "Offer made",
  won: "Bought",
  lost: "Did not buy",
};
export const CONTACT_PREFERENCES = ["email", "phone", "either"] as const;
export const CONTACT_LABELS: Record<(typeof CONTACT_PREFERENCES)[number], string> = { email: "E-mail", phone: "Phone", either: "Either" };
/** The least time a person takes to fill the enquiry form; faster is a script. */
export const MIN_FILL_MS = 3000;
