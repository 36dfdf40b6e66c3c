/**
 * Body profiles of our own for each body type, in millimetres. The side outline runs from the front bumper's lower
 * corner over the roof to the rear bumper's lower corner (front at x = 0); each edge carries the material of the
 * surface it sweeps across the width. Generic, invented proportions: no maker's shape is copied.
 */
import type { BODY_TYPES } from "../../../shared/constants/vehicle.ts";

export type BodyType = (typeof BODY_TYPES)[number];
export type Material = "paint" | "glass" | "dark" | "interior";

/** [x, y, corner radius, material of the edge to the next point] */
export type OutlinePoint = [number, number, number, Material?];

/** An extra solid (tray, headboard, headrest…), axis-aligned: x0..x1, y0..y1, half-width hz. */
export interface Box {
  x: [number, number];
  y: [number, number];
  hz: number;
  z?: number; // centre offset across the width (default 0); mirrored with `pair`
  pair?: boolean;
  fill: "paint" | "alloy" | "dark" | "interior" | "trim";
  layer: "body" | "top"; // body: ordered with the body by position; top: drawn over the body
}

export interface FrontRear {
  lampY: [number, number]; // lamp bottom and top heights
  lampU: [number, number]; // inner and outer edge as a fraction of the half-width
  grilleY?: [number, number];
  grilleU?: number;
  intakeY?: [number, number];
  intakeU?: number;
}

export interface BodySpec {
  length: number;
  width: number;
  wheelR: number;
  rimR: number;
  tyreW: number;
  wheelbase: number;
  frontAxle: number;
  sill: number;
  belt: number;
  taper: number; // greenhouse half-width at the roof as a fraction of the body half-width
  outline: OutlinePoint[];
  dlo: Array<[number, number]>; // daylight opening (side glass)
  pillars: Array<[number, number, "paint" | "trim"]>; // [x, width, finish] of pillars across the side glass
  doors: number[]; // x of vertical shut lines
  handles: number[]; // x of door handles
  rail?: [number, number, number]; // sliding-door rail: x0, x1, y
  cladding?: boolean;
  front: FrontRear;
  rear: FrontRear;
  cabRearWindow?: boolean; // ute/cab chassis: the cab's back wall has a window
  boxes?: Box[];
  windscreenOnly?: [number, number, number, number]; // convertible: windscreen frame x0,y0 → x1,y1
  rearDoors?: boolean; // van: split rear doors with windows
  rearFaceX?: number; // where the rear lamps sit when the body ends before the vehicle does (cab chassis)
}

const car = (o: Partial<FrontRear> = {}): FrontRear => ({
  lampY: [620, 760], lampU: [0.5, 0.93], grilleY: [420, 620], grilleU: 0.42, intakeY: [300, 400], intakeU: 0.6, ...o,
});
const tail = (o: Partial<FrontRear> = {}): FrontRear => ({ lampY: [740, 900], lampU: [0.55, 0.95], ...o });

export const BODIES: Record<BodyType, BodySpec> = {
  hatchback: {
    length: 4050, width: 1760, wheelR: 315, rimR: 205, tyreW: 205, wheelbase: 2580, frontAxle: 840, sill: 330, belt: 960, taper: 0.78,
    outline: [[20, 300, 40], [0, 520, 90], [70, 770, 150], [1150, 940, 60, "glass"], [1950, 1450, 220], [3550, 1430, 160, "glass"], [3920, 1020, 60], [4050, 760, 60], [4030, 300, 40]],
    dlo: [[1280, 990], [1960, 1390], [3500, 1380], [3790, 1000]],
    pillars: [[2560, 90, "trim"], [3330, 200, "paint"]],
    doors: [1230, 2560, 3360], handles: [2400, 3220],
    front: car({ lampY: [640, 770] }), rear: tail({ lampY: [780, 1000], lampU: [0.62, 0.96] }),
  },
  sedan: {
    length: 4700, width: 1800, wheelR: 320, rimR: 215, tyreW: 215, wheelbase: 2750, frontAxle: 930, sill: 330, belt: 950, taper: 0.78,
    outline: [[20, 300, 40], [0, 520, 100], [60, 740, 160], [1420, 920, 60, "glass"], [2150, 1430, 260], [3300, 1420, 240, "glass"], [3900, 1000, 80], [4620, 960, 70], [4700, 720, 70], [4680, 300, 40]],
    dlo: [[1560, 980], [2170, 1380], [3260, 1370], [3720, 990]],
    pillars: [[2760, 90, "trim"]],
    doors: [1480, 2760, 3640], handles: [2600, 3480],
    front: car(), rear: tail({ lampY: [760, 920] }),
  },
  wagon: {
    length: 4780, width: 1820, wheelR: 325, rimR: 215, tyreW: 215, wheelbase: 2800, frontAxle: 930, sill: 330, belt: 960, taper: 0.8,
    outline: [[20, 300, 40], [0, 520, 100], [60, 750, 160], [1400, 930, 60, "glass"], [2150, 1470, 260], [4380, 1450, 140, "glass"], [4700, 1000, 60], [4780, 760, 60], [4760, 300, 40]],
    dlo: [[1540, 990], [2170, 1410], [4330, 1400], [4620, 1000]],
    pillars: [[2780, 90, "trim"], [3840, 120, "trim"]],
    doors: [1460, 2780, 3800], handles: [2620, 3640],
    front: car(), rear: tail({ lampY: [800, 1000], lampU: [0.6, 0.96] }),
  },
  suv: {
    length: 4650, width: 1880, wheelR: 370, rimR: 250, tyreW: 235, wheelbase: 2730, frontAxle: 930, sill: 430, belt: 1130, taper: 0.82,
    outline: [[20, 380, 50], [0, 640, 110], [50, 900, 170], [1250, 1080, 60, "glass"], [1950, 1690, 250], [4300, 1680, 160, "glass"], [4580, 1180, 60], [4650, 900, 60], [4630, 380, 50]],
    dlo: [[1400, 1160], [1980, 1630], [4260, 1620], [4500, 1170]],
    pillars: [[2700, 100, "trim"], [3820, 150, "trim"]],
    doors: [1330, 2700, 3780], handles: [2540, 3620], cladding: true,
    front: car({ lampY: [760, 900], grilleY: [520, 760], grilleU: 0.48, intakeY: [380, 480] }),
    rear: tail({ lampY: [900, 1100], lampU: [0.6, 0.96] }),
  },
  ute: {
    length: 5300, width: 1870, wheelR: 380, rimR: 240, tyreW: 245, wheelbase: 3100, frontAxle: 920, sill: 480, belt: 1150, taper: 0.85,
    outline: [[20, 420, 50], [0, 680, 110], [40, 960, 160], [1150, 1120, 60, "glass"], [1850, 1770, 220], [3020, 1780, 80], [3060, 1180, 30, "dark"], [5290, 1180, 30], [5300, 560, 40], [5270, 420, 30]],
    dlo: [[1290, 1190], [1870, 1710], [2980, 1700], [2980, 1190]],
    pillars: [[2150, 100, "trim"]],
    doors: [1230, 2150, 2990, 3090], handles: [2000, 2840],
    cabRearWindow: true, cladding: true,
    front: car({ lampY: [800, 930], grilleY: [560, 820], grilleU: 0.5, intakeY: [430, 520] }),
    rear: tail({ lampY: [800, 1120], lampU: [0.86, 0.99] }),
  },
  van: {
    length: 5000, width: 1920, wheelR: 340, rimR: 215, tyreW: 215, wheelbase: 3000, frontAxle: 850, sill: 420, belt: 1150, taper: 0.92,
    outline: [[20, 380, 50], [0, 640, 120], [60, 950, 200], [700, 1180, 80, "glass"], [1500, 1930, 250], [4950, 1960, 60], [5000, 1880, 40], [4990, 420, 40]],
    dlo: [[860, 1220], [1500, 1870], [1880, 1870], [1880, 1220]],
    pillars: [],
    doors: [1230, 1950, 3250], handles: [1800, 3100], rail: [3250, 4900, 1250], rearDoors: true,
    front: car({ lampY: [820, 980], grilleY: [560, 800], grilleU: 0.45, intakeY: [430, 520] }),
    rear: tail({ lampY: [500, 1100], lampU: [0.9, 0.99] }),
  },
  coupe: {
    length: 4550, width: 1820, wheelR: 330, rimR: 230, tyreW: 235, wheelbase: 2650, frontAxle: 920, sill: 320, belt: 900, taper: 0.76,
    outline: [[20, 300, 40], [0, 500, 100], [60, 700, 180], [1550, 870, 60, "glass"], [2350, 1310, 280], [3050, 1290, 300, "glass"], [4050, 960, 80], [4480, 930, 70], [4550, 700, 70], [4530, 300, 40]],
    dlo: [[1680, 930], [2370, 1265], [3050, 1250], [3620, 940]],
    pillars: [[2980, 40, "trim"]],
    doors: [1620, 3050], handles: [2900],
    front: car({ lampY: [580, 700], grilleY: [380, 560], grilleU: 0.38 }), rear: tail({ lampY: [720, 880] }),
  },
  convertible: {
    length: 4400, width: 1800, wheelR: 325, rimR: 225, tyreW: 225, wheelbase: 2600, frontAxle: 880, sill: 320, belt: 880, taper: 0.9,
    outline: [[20, 300, 40], [0, 500, 100], [60, 700, 180], [1500, 880, 30, "interior"], [3300, 880, 40], [4330, 900, 70], [4400, 700, 70], [4380, 300, 40]],
    dlo: [], pillars: [],
    doors: [1560, 2900], handles: [2760],
    windscreenOnly: [1500, 880, 1930, 1250],
    boxes: [
      { x: [2470, 2610], y: [960, 1110], hz: 120, z: 400, pair: true, fill: "interior", layer: "top" },
      { x: [3330, 3800], y: [880, 960], hz: 760, fill: "dark", layer: "top" },
    ],
    front: car({ lampY: [580, 700], grilleY: [380, 560], grilleU: 0.4 }), rear: tail({ lampY: [700, 860] }),
  },
  people_mover: {
    length: 5000, width: 1900, wheelR: 345, rimR: 225, tyreW: 225, wheelbase: 3050, frontAxle: 900, sill: 400, belt: 1070, taper: 0.86,
    outline: [[20, 360, 50], [0, 620, 110], [50, 880, 180], [900, 1060, 70, "glass"], [1700, 1760, 260], [4650, 1760, 180, "glass"], [4940, 1150, 60], [5000, 880, 60], [4980, 360, 50]],
    dlo: [[1050, 1120], [1720, 1700], [4600, 1690], [4840, 1140]],
    pillars: [[2250, 110, "trim"], [3620, 130, "trim"]],
    doors: [1000, 2250, 3560], handles: [2100, 2400], rail: [3560, 4700, 1090],
    front: car({ lampY: [700, 840], grilleY: [460, 680], grilleU: 0.42 }), rear: tail({ lampY: [880, 1120], lampU: [0.64, 0.97] }),
  },
  cab_chassis: {
    length: 5200, width: 1850, wheelR: 375, rimR: 235, tyreW: 235, wheelbase: 3100, frontAxle: 920, sill: 480, belt: 1150, taper: 0.85,
    outline: [[20, 420, 50], [0, 680, 110], [40, 960, 160], [1150, 1120, 60, "glass"], [1850, 1770, 220], [2230, 1780, 70], [2270, 1180, 30], [2280, 480, 10]],
    dlo: [[1290, 1190], [1870, 1710], [2190, 1700], [2190, 1190]],
    pillars: [], doors: [1230, 2210], handles: [2060],
    cabRearWindow: true, cladding: true,
    boxes: [
      { x: [2300, 5000], y: [600, 860], hz: 420, fill: "dark", layer: "body" },
      { x: [2360, 5200], y: [860, 960], hz: 1000, fill: "alloy", layer: "body" },
      { x: [2380, 5190], y: [960, 1250], hz: 20, z: 980, pair: true, fill: "alloy", layer: "body" },
      { x: [5170, 5200], y: [960, 1250], hz: 960, fill: "alloy", layer: "body" },
      { x: [2330, 2400], y: [960, 1880], hz: 960, fill: "alloy", layer: "body" },
    ],
    front: car({ lampY: [800, 930], grilleY: [560, 820], grilleU: 0.5, intakeY: [430, 520] }),
    rear: { lampY: [640, 740], lampU: [0.55, 0.85] }, rearFaceX: 5200,
  },
};
