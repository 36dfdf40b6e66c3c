// One Transform per format: feed items in (objects), UTF-8 text out. CSV is written by csv-stringify (RFC 4180: CRLF,
// fields with commas, quotes or line breaks quoted, quotes doubled), every cell and header through csv-cell.ts so no
// cell starts a spreadsheet formula; XML by xmlbuilder2's streaming writer, which
// escapes text and attributes; JSON and JSON-LD by JSON.stringify, item by item. Nothing holds more than one item.
import { Transform, type TransformCallback } from "node:stream";
import { stringify } from "csv-stringify";
import { createCB } from "xmlbuilder2";
import type { FeedColumn, FeedFormat } from "../../../shared/schemas/feeds.ts";
import { carJsonLd } from "../publishing/seo.ts";
import { ALL_COLUMNS, cellOf, pageUrl, removedCell, xmlSafe, type CellContext, type FeedRow, type RemovedRow } from "./columns.ts";
import { csvCell, NEUTRALISED, neutralise } from "./csv-cell.ts";

export type FeedItem = { kind: "row"; row: FeedRow } | { kind: "removed"; row: RemovedRow };

export interface WriterOptions {
  format: FeedFormat;
  columns: FeedColumn[];
  cells: CellContext;
  name: string;
  since?: Date;
  /** A UTF-8 byte order mark first (CSV only): spreadsheet programs then read the text as UTF-8, not a legacy code page. */
  bom?: boolean;
}

export const CONTENT_TYPES: Record<FeedFormat, string> = {
  csv: "text/csv; charset=utf-8; header=present",
  json: "application/json; charset=utf-8",
  jsonld: "application/ld+json; charset=utf-8",
  xml: "application/xml; charset=utf-8",
};

/** The CSV writer: items to records, then csv-stringify. Two stages of the one pipeline. */
export function csvWriter(o: WriterOptions): Transform[] {
  const toRecord = new Transform({
    writableObjectMode: true,
    readableObjectMode: true,
    transform(item: FeedItem, _enc, cb) {
      cb(null, o.columns.map((col) => csvCell(item.kind === "row" ? cellOf(item.row, o.cells, col) : removedCell(item.row, o.cells, col))));
    },
  });
  // Headers are chosen by staff, so they are neutralised like the cells.
  const columns = o.columns.map((c) => neutralise(c.header));
  return [toRecord, stringify({ header: true, columns, record_delimiter: "\r\n", eof: true, quoted_match: NEUTRALISED, bom: o.bom === true })];
}

/** Feeds its own items through a Transform whose output is text pushed by the format. */
abstract class TextWriter extends Transform {
  protected count = 0;
  private started = false;
  constructor(protected o: WriterOptions) {
    super({ writableObjectMode: true, readableObjectMode: false });
  }
  protected abstract head(): void;
  protected abstract item(item: FeedItem): void;
  protected abstract tail(): void;
  override _transform(item: FeedItem, _enc: BufferEncoding, cb: TransformCallback) {
    try {
      if (!this.started) {
        this.started = true;
        this.head();
      }
      this.item(item);
      this.count++;
      cb();
    } catch (e) {
      cb(e as Error);
    }
  }
  override _flush(cb: TransformCallback) {
    try {
      if (!this.started) this.head();
      this.tail();
      cb();
    } catch (e) {
      cb(e as Error);
    }
  }
}

class JsonWriter extends TextWriter {
  protected head() {
    this.push(`{"generatedAt":${JSON.stringify(this.o.cells.now.toISOString())},"since":${JSON.stringify(this.o.since?.toISOString() ?? null)},"vehicles":[`);
  }
  protected item(item: FeedItem) {
    let value: Record<string, unknown>;
    if (item.kind === "removed") {
      const { stockNumber, slug, removedAt } = item.row;
      value = { stockNumber, url: pageUrl(this.o.cells.publicUrl, slug), removed: true, removedAt: removedAt.toISOString() };
    } else {
      value = {};
      for (const col of ALL_COLUMNS) value[col.key] = cellOf(item.row, this.o.cells, col);
    }
    this.push((this.count ? ",\n" : "\n") + JSON.stringify(value));
  }
  protected tail() {
    this.push(`\n],"count":${this.count}}\n`);
  }
}

const SCHEMA = "https://schema.org/";

/** schema.org ItemList of Car, each built by the public page's own carJsonLd (publishing/seo.ts). */
class JsonLdWriter extends TextWriter {
  protected head() {
    this.push(`{"@context":"https://schema.org","@type":"ItemList","name":${JSON.stringify(this.o.name)},"dateModified":${JSON.stringify(this.o.cells.now.toISOString())},"itemListElement":[`);
  }
  protected item(item: FeedItem) {
    const base = this.o.cells.publicUrl;
    let car: Record<string, unknown>;
    if (item.kind === "removed") {
      const url = pageUrl(base, item.row.slug);
      // A portal syncing changes learns the car is gone: no longer offered.
      car = { "@type": "Car", sku: item.row.stockNumber, url, offers: { "@type": "Offer", availability: `${SCHEMA}Discontinued`, availabilityEnds: item.row.removedAt.toISOString(), url } };
    } else {
      const r = item.row;
      const { "@context": _context, ...rest } = carJsonLd(r.snapshot, r.status, pageUrl(base, r.slug), base);
      car = { ...rest, sku: r.stockNumber };
      const reading = r.snapshot.odometer;
      const unit = this.o.cells.units.distance;
      // carJsonLd states the odometer as read; the feed states it in its own units (KMT or SMI, TRADE.md §7).
      if (reading.km != null && reading.unit !== unit) {
        const value = cellOf(r, this.o.cells, { key: "odometer", header: "odometer" });
        car.mileageFromOdometer = { "@type": "QuantitativeValue", value, unitCode: unit === "mi" ? "SMI" : "KMT" };
      }
    }
    this.push((this.count ? ",\n" : "\n") + JSON.stringify({ "@type": "ListItem", position: this.count + 1, item: car }));
  }
  protected tail() {
    this.push(`\n],"numberOfItems":${this.count}}\n`);
  }
}

class XmlWriter extends TextWriter {
  private xml: ReturnType<typeof createCB>;
  constructor(o: WriterOptions) {
    super(o);
    this.xml = createCB({ data: (chunk: string) => this.push(chunk), prettyPrint: true, indent: "  ", newline: "\n" });
  }
  protected head() {
    this.xml.dec({ version: "1.0", encoding: "UTF-8" });
    const root = this.xml.ele("vehicles").att("generatedAt", this.o.cells.now.toISOString());
    if (this.o.since) root.att("since", this.o.since.toISOString());
  }
  protected item(item: FeedItem) {
    const v = this.xml.ele("vehicle");
    if (item.kind === "removed") v.att("removed", "true").att("removedAt", item.row.removedAt.toISOString());
    for (const col of this.o.columns) {
      const value = item.kind === "row" ? cellOf(item.row, this.o.cells, col) : removedCell(item.row, this.o.cells, col);
      const el = this.xml.ele(col.header);
      if (Array.isArray(value)) for (const x of value) this.xml.ele(col.key === "photoUrls" ? "url" : "item").txt(xmlSafe(x)).up();
      else if (value != null && value !== "") el.txt(xmlSafe(String(value)));
      this.xml.up();
    }
    this.xml.up();
  }
  protected tail() {
    this.xml.up();
    this.xml.end();
  }
}

/** The writer stages for a format: FeedItems in at the first, UTF-8 text out of the last. */
export function writerFor(o: WriterOptions): Transform[] {
  if (o.format === "csv") return csvWriter(o);
  return [o.format === "json" ? new JsonWriter(o) : o.format === "jsonld" ? new JsonLdWriter(o) : new XmlWriter(o)];
}
