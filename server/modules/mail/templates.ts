import type { Dealership } from "../../db/schema/index.ts";

const esc = (s: string) => s.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;").replace(/"/g, "&quot;");

/** Every mail: plain text and a matching simple HTML part, the dealership's details at the foot, no tracking pixels. */
function compose(d: Pick<Dealership, "name" | "addressLine" | "town" | "phone" | "email" | "licenceNumber">, subject: string, paragraphs: string[], link?: { label: string; url: string }) {
  const foot = [d.name, [d.addressLine, d.town].filter(Boolean).join(", "), d.phone, d.email, d.licenceNumber ? `Dealer licence ${d.licenceNumber}` : ""].filter(Boolean);
  const text = [...paragraphs, ...(link ? [`${link.label}: ${link.url}`] : []), "", "--", ...foot].join("\n\n").replace(/\n\n--\n\n/, "\n\n--\n");
  const html = `<!doctype html><html><body style="font-family:sans-serif;color:#18212c;line-height:1.5;max-width:36rem">
${paragraphs.map((p) => `<p>${esc(p).replace(/\n/g, "<br>")}</p>`).join("\n")}
${link ? `<p><a href="${esc(link.url)}" style="color:#1d6a61;font-weight:bold">${esc(link.label)}</a></p>` : ""}
<hr style="border:0;border-top:1px solid #d6cfc1"><p style="font-size:13px;color:#46505e">${foot.map(esc).join("<br>")}</p>
</body></html>`;
  return { subject, text, html };
}

export interface EnquiryMailData {
  vehicleTitle: string;
  stockNumber: string;
  url: string;
  name: string;
  email: string;
  phone: string;
  message: string;
  preferredContact: string;
  tradeIn: string | null;
  leadUrl: string;
}

export const enquiryToStaff = (d: Dealership, e: EnquiryMailData) =>
  compose(
    d,
    `Enquiry: ${e.vehicleTitle} (stock ${e.stockNumber}) from ${e.name}`,
    [
      `${e.name} asked about the ${e.vehicleTitle}, stock number ${e.stockNumber}.`,
      `"${e.message}"`,
      `Reply by: ${e.preferredContact}. E-mail: ${e.email || "not given"}. Phone: ${e.phone || "not given"}.`,
      ...(e.tradeIn ? [`Trade-in offered: ${e.tradeIn}.`] : []),
    ],
    { label: "Open the lead", url: e.leadUrl },
  );

export const enquiryConfirmation = (d: Dealership, e: EnquiryMailData) =>
  compose(
    d,
    `We have your question about the ${e.vehicleTitle}`,
    [
      `Hello ${e.name},`,
      `Thank you for asking about the ${e.vehicleTitle} (stock number ${e.stockNumber}). A member of our sales team will ${e.preferredContact === "phone" ? "call you" : e.preferredContact === "email" ? "reply by e-mail" : "get back to you"}, usually within one working day.`,
      `Your message: "${e.message}"`,
      "The condition report you were reading stays online at the link below, exactly as you saw it.",
    ],
    { label: "The condition report", url: e.url },
  );

export const inviteMail = (d: Dealership, who: { name: string; role: string; url: string; invitedBy: string }) =>
  compose(
    d,
    `You are invited to Forthright at ${d.name}`,
    [`Hello ${who.name},`, `${who.invitedBy} has invited you to ${d.name}'s Forthright as ${who.role}.`, "Choose your own password with the link below. The link works once and expires in 7 days."],
    { label: "Set your password", url: who.url },
  );

export const resetMail = (d: Dealership, who: { name: string; url: string }) =>
  compose(
    d,
    "Reset your Forthright password",
    [`Hello ${who.name},`, "Someone asked to reset the password of your Forthright account. If it was you, use the link below within an hour; it works once.", "If it was not you, ignore this mail: your password stays as it is."],
    { label: "Choose a new password", url: who.url },
  );

export const shareMail = (d: Dealership, s: { toName: string; fromName: string; vehicleTitle: string; url: string; message: string }) =>
  compose(
    d,
    `The condition report of the ${s.vehicleTitle}`,
    [`Hello${s.toName ? ` ${s.toName}` : ""},`, `${s.fromName} at ${d.name} sent you the condition report of the ${s.vehicleTitle}: photos, every mark we found, tyre measurements and checks.`, ...(s.message ? [s.message] : [])],
    { label: "Read the condition report", url: s.url },
  );

export const leadReply = (d: Dealership, r: { toName: string; fromName: string; vehicleTitle: string; body: string; url: string }) =>
  compose(d, `Re: your question about the ${r.vehicleTitle}`, [`Hello ${r.toName},`, r.body, `${r.fromName}, ${d.name}`], { label: "The condition report", url: r.url });
