import { eq } from "drizzle-orm";
import type { Db } from "../db/client.ts";
import { dealerships, users, vehicleEvents, vehicles } from "../db/schema/index.ts";
import { dayIn, DAY_MS } from "../lib/clock.ts";
import { deriveFor } from "../modules/vehicles/vehicles.service.ts";
import { STATUS_MOVES } from "../../shared/domain/status.ts";
import type { VehicleStatus } from "../../shared/constants/vehicle.ts";
import { demoVehicles } from "./demo-vehicles.ts";

/** The shortest path from intake to a status along the allowed moves, so each demo vehicle has a believable history. */
function pathTo(target: VehicleStatus): VehicleStatus[] {
  const queue: VehicleStatus[][] = [["intake"]];
  while (queue.length) {
    const path = queue.shift()!;
    const last = path[path.length - 1];
    if (last === target) return path;
    for (const m of STATUS_MOVES) if (m.from === last && !path.includes(m.to)) queue.push([...path, m.to]);
  }
  return ["intake"];
}

export async function seedDemoVehicles(db: Db, dealershipId: number, now = new Date()): Promise<void> {
  const [d] = await db.select().from(dealerships).where(eq(dealerships.id, dealershipId));
  const staff = await db.select().from(users).where(eq(users.dealershipId, dealershipId));
  const sales = staff.find((u) => u.role === "sales") ?? staff[0];
  const workshop = staff.find((u) => u.role === "workshop") ?? sales;
  const today = dayIn(d.timeZone, now);
  let stock = d.lastStockNumber;
  await db.transaction(async (tx) => {
    for (const demo of demoVehicles(today)) {
      const { odometerKm, ...input } = demo.input;
      const row = { ...input, make: input.make!, model: input.model!, odometerReading: odometerKm ?? null, odometerUnit: "km" as const, features: input.features ?? [], serviceHistory: input.serviceHistory ?? [] };
      const stockedAt = new Date(now.getTime() - demo.stockedDaysAgo * DAY_MS);
      stock += 1;
      const [res] = await tx.insert(vehicles).values({
        ...row,
        dealershipId,
        salespersonId: sales.id,
        stockNumber: String(stock),
        status: demo.status,
        odometerKmIndex: row.odometerReading,
        derived: deriveFor(row, d, today),
        stockedAt,
        createdAt: stockedAt,
      });
      const steps = pathTo(demo.status);
      const span = (now.getTime() - stockedAt.getTime()) / Math.max(1, steps.length);
      await tx.insert(vehicleEvents).values(
        steps.map((to, i) => ({
          vehicleId: res.insertId,
          fromStatus: i === 0 ? null : steps[i - 1],
          toStatus: to,
          note: i === 0 ? "Taken into stock" : "",
          userId: (to === "preparing" ? workshop : sales).id,
          userName: (to === "preparing" ? workshop : sales).name,
          at: new Date(stockedAt.getTime() + span * i),
        })),
      );
    }
    await tx.update(dealerships).set({ lastStockNumber: stock }).where(eq(dealerships.id, dealershipId));
  });
}
