import { describe, expect, it } from "vitest";
import { INTERVAL_SERVICE_KINDS, analyseServiceHistory, nextService, type ServiceEntry } from "../../../shared/domain/service.ts";

const entry = (date: string, odometerKm: number | null, kind: ServiceEntry["kind"] = "scheduled"): ServiceEntry => ({
  date,
  odometerKm,
  kind,
  workshop: "Workshop",
  notes: null,
});

describe("nextService", () => {
  it("when last serviced 2024-03-01 at 45,000 km on a 15,000 km / 12-month rule, then due 2025-03-01 or 60,000 km", () => {
    // TRADE.md §10 test (CP, common practice, no source)
    const result = nextService([entry("2024-03-01", 45_000)], 50_000, 15_000, 12, "2024-09-01");
    expect(result).toEqual({
      dueByDate: "2025-03-01",
      dueByKm: 60_000,
      overdue: false,
      overdueReasons: [],
      lastServiceDate: "2024-03-01",
      lastServiceKm: 45_000,
    });
  });

  it("when today is past the due date, then overdue by date", () => {
    const result = nextService([entry("2024-03-01", 45_000)], 50_000, 15_000, 12, "2025-03-02")!;
    expect(result.overdue).toBe(true);
    expect(result.overdueReasons).toEqual(["date"]);
  });

  it("when today is the due date itself, then due but not overdue", () => {
    expect(nextService([entry("2024-03-01", 45_000)], 50_000, 15_000, 12, "2025-03-01")!.overdue).toBe(false);
  });

  it("when the odometer is past the due distance, then overdue by distance", () => {
    const result = nextService([entry("2024-03-01", 45_000)], 60_001, 15_000, 12, "2024-09-01")!;
    expect(result.overdueReasons).toEqual(["distance"]);
    expect(nextService([entry("2024-03-01", 45_000)], 60_000, 15_000, 12, "2024-09-01")!.overdue).toBe(false);
  });

  it("when the last service was on 31 January, then the 1-month due date is clamped to the end of February", () => {
    expect(nextService([entry("2024-01-31", 10_000)], 10_500, 15_000, 1, "2024-02-10")!.dueByDate).toBe("2024-02-29");
  });

  it("when only repairs, recalls, inspections and tyre work are recorded, then null (they do not restart the interval)", () => {
    const entries = ["repair", "recall", "inspection", "tyres", "other"].map((kind) => entry("2024-03-01", 45_000, kind));
    expect(nextService(entries, 50_000, 15_000, 12, "2024-09-01")).toBeNull();
    expect(INTERVAL_SERVICE_KINDS).toEqual(["scheduled", "intermediate"]);
  });

  it("when an intermediate service follows a scheduled one, then the intermediate one counts as the last service", () => {
    const entries = [entry("2023-03-01", 30_000), entry("2024-03-01", 45_000, "intermediate"), entry("2024-06-01", 48_000, "repair")];
    expect(nextService(entries, 50_000, 15_000, 12, "2024-09-01")!.lastServiceDate).toBe("2024-03-01");
  });

  it("when an entry is dated after today, then it is ignored", () => {
    const entries = [entry("2024-03-01", 45_000), entry("2030-01-01", 99_000)];
    expect(nextService(entries, 50_000, 15_000, 12, "2024-09-01")!.lastServiceKm).toBe(45_000);
  });

  it("when there is no history, no interval or no valid today, then null", () => {
    expect(nextService([], 50_000, 15_000, 12, "2024-09-01")).toBeNull();
    expect(nextService(null, 50_000, 15_000, 12, "2024-09-01")).toBeNull();
    expect(nextService([entry("2024-03-01", 45_000)], 50_000, null, null, "2024-09-01")).toBeNull();
    expect(nextService([entry("2024-03-01", 45_000)], 50_000, 15_000, 12, "not a date")).toBeNull();
  });

  it("when the last service has no odometer reading, then dueByKm is null but the date still applies", () => {
    const result = nextService([entry("2024-03-01", null)], 50_000, 15_000, 12, "2024-09-01")!;
    expect(result.dueByKm).toBeNull();
    expect(result.dueByDate).toBe("2025-03-01");
  });
});

describe("analyseServiceHistory", () => {
  it("when a later entry reads 44,000 km after 45,000 km, then an odometer-decreased flag is raised, not a refusal", () => {
    // TRADE.md §10 test (CP, common practice, no source)
    const result = analyseServiceHistory([entry("2024-03-01", 45_000), entry("2024-09-01", 44_000, "repair")]);
    expect(result.sorted).toHaveLength(2);
    expect(result.odometerFlags).toEqual([
      { code: "odometer_decreased", earlierIndex: 0, laterIndex: 1, earlierKm: 45_000, laterKm: 44_000, earlierDate: "2024-03-01", laterDate: "2024-09-01" },
    ]);
  });

  it("when entries arrive out of order, then they are sorted by date and flags point at the caller's indices", () => {
    const result = analyseServiceHistory([entry("2024-09-01", 44_000), entry("2022-01-01", 20_000), entry("2024-03-01", 45_000)]);
    expect(result.sorted.map((e) => e.index)).toEqual([1, 2, 0]);
    expect(result.odometerFlags.map((f) => [f.earlierIndex, f.laterIndex])).toEqual([[2, 0]]);
  });

  it("when a reading stays below an earlier peak for two entries, then both are flagged against the peak", () => {
    const result = analyseServiceHistory([entry("2022-01-01", 50_000), entry("2023-01-01", 40_000), entry("2024-01-01", 45_000)]);
    expect(result.odometerFlags.map((f) => [f.earlierIndex, f.laterIndex])).toEqual([[0, 1], [0, 2]]);
  });

  it("when two entries share a date, then they are ordered by odometer and raise no flag", () => {
    expect(analyseServiceHistory([entry("2024-01-01", 45_100), entry("2024-01-01", 45_000)]).odometerFlags).toEqual([]);
  });

  it("when an entry has no date or no reading, then it is listed as undated or skipped in the odometer check", () => {
    const result = analyseServiceHistory([entry("yesterday", 1), entry("2024-01-01", null), entry("2024-02-01", 10)]);
    expect(result.undatedIndices).toEqual([0]);
    expect(result.odometerFlags).toEqual([]);
  });
});
