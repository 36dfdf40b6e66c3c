import { describe, expect, it } from "vitest";
import { readiness, type ReadinessInput } from "../../../shared/domain/readiness.ts";

const ready: ReadinessInput = {
  vin: { present: true, structurallyValid: true, checkDigitBlocking: false },
  priceCents: 1_000_000,
  description: "A tidy car with a full service history.",
  photos: { count: 8, processing: 0, hasCover: true },
  minPhotos: 4,
  zones: [{ zone: "front", state: "nothing_found" }],
  roadTyresMeasured: 4,
  blockingCautions: [],
  unrepairedSafetyDefects: [],
};

describe("readiness: defects that affect safety", () => {
  it("when nothing affecting safety is unrepaired, then the item is met", () => {
    const r = readiness(ready);
    expect(r.ready).toBe(true);
    expect(r.items.find((i) => i.code === "safety_defects")).toMatchObject({ ok: true, section: "walkaround" });
  });

  it("when a defect affecting safety is not repaired before sale, then it blocks publishing, in plain words naming the item", () => {
    const r = readiness({ ...ready, unrepairedSafetyDefects: [3, 5] });
    expect(r.ready).toBe(false);
    const item = r.missing.find((i) => i.code === "safety_defects")!;
    expect(item.label).toBe("No unrepaired defect that affects safety");
    expect(item.detail).toMatch(/^Items 3 and 5 affect safety and are not repaired\./);
    expect(item.detail).toMatch(/Repaired before sale/);
    expect(readiness({ ...ready, unrepairedSafetyDefects: [3] }).missing[0].detail).toMatch(/^Item 3 affects safety and is not repaired\./);
  });
});
