/**
 * Small geometry kit for the demo illustrations: an orthographic camera (yaw around the vertical axis, pitch down),
 * rounded outlines, convex hulls, and an SVG document builder with deterministic ids.
 *
 * Model space is millimetres: x along the vehicle (front at the smaller x), y up from the ground, z across the vehicle
 * (+z is the vehicle's left side). Screen space after projection: x right, y up, depth towards the viewer.
 */

export type P2 = [number, number];
export type P3 = [number, number, number];

export interface Camera {
  yaw: number; // radians; 0 looks at the left side, +90° at the front, -90° at the rear
  pitch: number; // radians; camera above, looking down
}

export function project(p: P3, cam: Camera): P3 {
  const ca = Math.cos(cam.yaw);
  const sa = Math.sin(cam.yaw);
  const x1 = p[0] * ca + p[2] * sa;
  const z1 = -p[0] * sa + p[2] * ca;
  const cp = Math.cos(cam.pitch);
  const sp = Math.sin(cam.pitch);
  return [x1, p[1] * cp - z1 * sp, z1 * cp + p[1] * sp];
}

/** How much a surface with this outward normal faces the camera (> 0: visible). */
export function facing(n: P3, cam: Camera): number {
  const len = Math.hypot(n[0], n[1], n[2]) || 1;
  return project([n[0] / len, n[1] / len, n[2] / len], cam)[2];
}

export function sub(a: P3, b: P3): P3 {
  return [a[0] - b[0], a[1] - b[1], a[2] - b[2]];
}

export function cross(a: P3, b: P3): P3 {
  return [a[1] * b[2] - a[2] * b[1], a[2] * b[0] - a[0] * b[2], a[0] * b[1] - a[1] * b[0]];
}

export function dot(a: P3, b: P3): number {
  return a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
}

export function normalize(a: P3): P3 {
  const l = Math.hypot(a[0], a[1], a[2]) || 1;
  return [a[0] / l, a[1] / l, a[2] / l];
}

/** A corner of an outline: position and the radius used to round it. */
export interface Corner {
  x: number;
  y: number;
  r: number;
}

/** Turns a polyline with per-corner radii into a dense polyline with rounded corners (ends stay sharp). */
export function roundCorners(pts: Corner[], closed = false, steps = 5): P2[] {
  const out: P2[] = [];
  const n = pts.length;
  for (let i = 0; i < n; i++) {
    const p = pts[i];
    const hasPrev = closed || i > 0;
    const hasNext = closed || i < n - 1;
    if (!hasPrev || !hasNext || p.r <= 0) {
      out.push([p.x, p.y]);
      continue;
    }
    const a = pts[(i - 1 + n) % n];
    const b = pts[(i + 1) % n];
    const la = Math.hypot(a.x - p.x, a.y - p.y);
    const lb = Math.hypot(b.x - p.x, b.y - p.y);
    const r = Math.min(p.r, la * 0.45, lb * 0.45);
    const s: P2 = [p.x + ((a.x - p.x) / la) * r, p.y + ((a.y - p.y) / la) * r];
    const e: P2 = [p.x + ((b.x - p.x) / lb) * r, p.y + ((b.y - p.y) / lb) * r];
    for (let k = 0; k <= steps; k++) {
      const t = k / steps;
      const u = 1 - t;
      out.push([u * u * s[0] + 2 * u * t * p.x + t * t * e[0], u * u * s[1] + 2 * u * t * p.y + t * t * e[1]]);
    }
  }
  return out;
}

/** Convex hull (monotone chain), counter-clockwise. */
export function hull(points: P2[]): P2[] {
  const p = [...points].sort((a, b) => a[0] - b[0] || a[1] - b[1]);
  if (p.length < 3) return p;
  const turn = (o: P2, a: P2, b: P2) => (a[0] - o[0]) * (b[1] - o[1]) - (a[1] - o[1]) * (b[0] - o[0]);
  const lower: P2[] = [];
  for (const q of p) {
    while (lower.length >= 2 && turn(lower[lower.length - 2], lower[lower.length - 1], q) <= 0) lower.pop();
    lower.push(q);
  }
  const upper: P2[] = [];
  for (let i = p.length - 1; i >= 0; i--) {
    const q = p[i];
    while (upper.length >= 2 && turn(upper[upper.length - 2], upper[upper.length - 1], q) <= 0) upper.pop();
    upper.push(q);
  }
  return lower.slice(0, -1).concat(upper.slice(0, -1));
}

export function circle(cx: number, cy: number, r: number, n = 40, rx = r): P2[] {
  const out: P2[] = [];
  for (let i = 0; i < n; i++) {
    const a = (i / n) * Math.PI * 2;
    out.push([cx + Math.cos(a) * rx, cy + Math.sin(a) * r]);
  }
  return out;
}

const f = (v: number) => (Math.round(v * 10) / 10).toString();

/** Polygon path data from screen points (y already pointing down). */
export function pathD(pts: P2[], closed = true): string {
  if (pts.length === 0) return "";
  return "M" + pts.map((p) => f(p[0]) + " " + f(p[1])).join("L") + (closed ? "Z" : "");
}

export function num(v: number): string {
  return f(v);
}

/** Collects SVG defs and drawing elements; ids are sequential, so the output is deterministic. */
export class Svg {
  private defs: string[] = [];
  private items: string[] = [];
  private next = 0;

  constructor(readonly width: number, readonly height: number) {}

  id(prefix: string): string {
    this.next += 1;
    return `${prefix}${this.next}`;
  }

  def(markup: string): void {
    this.defs.push(markup);
  }

  add(markup: string): void {
    this.items.push(markup);
  }

  /** A linear gradient in user space; stops are [offset 0..1, colour, opacity?]. */
  linear(x1: number, y1: number, x2: number, y2: number, stops: Array<[number, string, number?]>): string {
    const id = this.id("g");
    const s = stops.map(([o, c, a]) => `<stop offset="${f(o)}" stop-color="${c}"${a === undefined ? "" : ` stop-opacity="${f(a)}"`}/>`).join("");
    this.def(`<linearGradient id="${id}" gradientUnits="userSpaceOnUse" x1="${f(x1)}" y1="${f(y1)}" x2="${f(x2)}" y2="${f(y2)}">${s}</linearGradient>`);
    return `url(#${id})`;
  }

  radial(cx: number, cy: number, r: number, stops: Array<[number, string, number?]>, fx = cx, fy = cy): string {
    const id = this.id("r");
    const s = stops.map(([o, c, a]) => `<stop offset="${f(o)}" stop-color="${c}"${a === undefined ? "" : ` stop-opacity="${f(a)}"`}/>`).join("");
    this.def(`<radialGradient id="${id}" gradientUnits="userSpaceOnUse" cx="${f(cx)}" cy="${f(cy)}" r="${f(r)}" fx="${f(fx)}" fy="${f(fy)}">${s}</radialGradient>`);
    return `url(#${id})`;
  }

  blur(std: number): string {
    const id = this.id("b");
    this.def(`<filter id="${id}" x="-50%" y="-50%" width="200%" height="200%"><feGaussianBlur stdDeviation="${f(std)}"/></filter>`);
    return `url(#${id})`;
  }

  clip(d: string): string {
    const id = this.id("c");
    this.def(`<clipPath id="${id}"><path d="${d}"/></clipPath>`);
    return `url(#${id})`;
  }

  /** Fills a polygon; extra attributes are passed through verbatim. */
  poly(pts: P2[], fill: string, extra = ""): void {
    if (pts.length < 3) return;
    this.add(`<path d="${pathD(pts)}" fill="${fill}"${extra ? " " + extra : ""}/>`);
  }

  line(pts: P2[], stroke: string, width: number, extra = ""): void {
    if (pts.length < 2) return;
    this.add(`<path d="${pathD(pts, false)}" fill="none" stroke="${stroke}" stroke-width="${f(width)}" stroke-linecap="round" stroke-linejoin="round"${extra ? " " + extra : ""}/>`);
  }

  toString(): string {
    return (
      `<svg xmlns="http://www.w3.org/2000/svg" width="${this.width}" height="${this.height}" viewBox="0 0 ${this.width} ${this.height}">` +
      `<defs>${this.defs.join("")}</defs>${this.items.join("")}</svg>`
    );
  }
}
