/**
 * The permissions table checked against the product's roles as ../shared/PRODUCT.md ("Who uses it") states them,
 * written out here independently, role by role. The route × role matrix (tests/api/security.test.ts) takes its callers
 * from the table, so this is what keeps a wrong line in the table from passing the matrix too.
 */
import { describe, expect, it } from "vitest";
import { ACTIONS, rolesFor, type Action } from "../../shared/permissions.ts";
import { GROUP_EDITORS } from "../../shared/constants/vehicle-fields.ts";

// PRODUCT.md "Who uses it": admin may do everything; sales creates and edits vehicles, photos, defects, copy and price,
// publishes and works enquiries; workshop records tyres, checks, defects and photos, cannot set price or publish;
// marketing reads all stock, manages feeds, edits listing copy only. Lead counts for marketing, the workshop's start
// of preparation and admin-only moves are the product's own decisions (DEVELOPERS.md), not PRODUCT.md's words.
const SALES: Action[] = [
  "staff.enter", "vehicles.read", "vehicle.create", "vehicle.edit", "vehicle.identity.edit", "vehicle.specification.edit",
  "vehicle.economy.edit", "vehicle.history.edit", "vehicle.listing.edit", "vehicle.price.edit", "vehicle.status.move",
  "status.prepare", "status.send-back", "status.sell", "evidence.write", "vehicle.publish", "vehicle.share", "leads.read",
  "leads.work", "leads.stats", "dealership.read",
];
const WORKSHOP: Action[] = [
  "staff.enter", "vehicles.read", "vehicle.edit", "vehicle.specification.edit", "vehicle.economy.edit", "vehicle.history.edit",
  "vehicle.status.move", "status.prepare", "evidence.write", "dealership.read",
];
const MARKETING: Action[] = ["staff.enter", "vehicles.read", "vehicle.edit", "vehicle.listing.edit", "leads.stats", "feeds.manage", "dealership.read"];

describe("permissions table", () => {
  it("when the table is read role by role, then it gives each role what the product's roles say and no more", () => {
    for (const action of ACTIONS) {
      const expected = ["admin", ...(SALES.includes(action) ? ["sales"] : []), ...(WORKSHOP.includes(action) ? ["workshop"] : []),
        ...(MARKETING.includes(action) ? ["marketing"] : [])];
      expect([...rolesFor(action)].sort(), action).toEqual(expected.sort());
    }
  });

  it("when the editor's field groups are read, then price and identity are sales' and admin's, listing copy also marketing's", () => {
    expect(GROUP_EDITORS).toEqual({
      identity: ["admin", "sales"],
      specification: ["admin", "sales", "workshop"],
      economy: ["admin", "sales", "workshop"],
      history: ["admin", "sales", "workshop"],
      listing: ["admin", "sales", "marketing"],
      price: ["admin", "sales"],
    });
  });
});
