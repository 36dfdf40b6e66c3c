import { describe, expect, it } from "vitest";
import { summariseDefects } from "../../../shared/domain/condition-index.ts";

const d = (zone: string, severity: "minor" | "moderate" | "major", safetyRelevant?: boolean) => ({ zone, severity, safetyRelevant });

describe("summariseDefects", () => {
  it("when 14 items are all assessed as not affecting safety, then '14 items noted, none affecting safety.'", () => {
    const items = [...Array.from({ length: 10 }, () => d("front", "minor", false)), ...Array.from({ length: 4 }, () => d("rear", "moderate", false))];
    const summary = summariseDefects(items);
    expect(summary.sentence).toBe("14 items noted, none affecting safety.");
    expect(summary.byZone).toEqual({ front: 10, rear: 4 });
    expect(summary.bySeverity).toEqual({ minor: 10, moderate: 4, major: 0 });
  });

  it("when one item affects safety, then it is counted in the sentence", () => {
    expect(summariseDefects([d("glass", "major", true), d("front", "minor")]).sentence).toBe("2 items noted, 1 affecting safety.");
  });

  it("when some items were not assessed for safety and none is marked, then no safety claim is made", () => {
    const summary = summariseDefects([d("front", "minor", false), d("roof", "minor")]);
    expect(summary.sentence).toBe("2 items noted.");
    expect(summary.affectingSafety).toBeNull();
  });

  it("when there is one item or none, then the sentence reads naturally", () => {
    expect(summariseDefects([d("front", "minor", false)]).sentence).toBe("1 item noted, none affecting safety.");
    expect(summariseDefects([]).sentence).toBe("No items noted.");
    expect(summariseDefects(null).total).toBe(0);
  });
});
