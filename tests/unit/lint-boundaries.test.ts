// The seams in eslint.config.js are regular expressions over import strings; these cases keep them from going quietly
// blind (a pattern that matches nothing passes every file). Types are off: the boundary rules need none.
import { ESLint } from "eslint";
import tseslint from "typescript-eslint";
import { describe, expect, it } from "vitest";

const eslint = new ESLint({
  overrideConfig: [tseslint.configs.disableTypeChecked],
  ruleFilter: ({ ruleId }) => ruleId === "@typescript-eslint/no-restricted-imports" || ruleId === "no-restricted-syntax",
});

async function blocked(filePath: string, code: string) {
  const [result] = await eslint.lintText(code, { filePath });
  return result.messages.map((m) => m.ruleId ?? m.message);
}

const presenter = "../../../../server/modules/vehicles/vehicles.presenter.ts";

describe("lint boundaries", () => {
  it.each([
    ["src/features/x/api/a.ts", `import type { A } from "${presenter}"; export type B = A;`],
    ["src/features/x/api/a.ts", `import { type A } from "${presenter}"; export type B = A;`],
    ["src/features/x/api/a.ts", `export type B = import("${presenter}").A;`],
    ["src/features/x/api/a.ts", `import { A } from "../../../../shared/domain/units.ts"; export const B = A;`],
    ["shared/domain/a.ts", `import { A } from "../schemas/fields.ts"; export const B = A;`],
    ["server/modules/vehicles/a.ts", `import { A } from "./vehicles.queries.ts"; export const B = A;`],
    ["server/modules/vehicles/a.ts", `import { A } from "../photos/photos.service.ts"; export const B = A;`],
    ["server/lib/a.ts", `import { A } from "../modules/photos/photos.queries.ts"; export const B = A;`],
  ])("when %s writes %s, then it passes", async (file, code) => {
    expect(await blocked(file, code)).toEqual([]);
  });

  it.each([
    ["src/features/x/api/a.ts", `import { A } from "${presenter}"; export const B = A;`],
    ["src/features/x/api/a.ts", `import { type A, C } from "${presenter}"; export type B = A; export const D = C;`],
    ["src/features/x/api/a.ts", `import type { A } from "../../../../server/modules/vehicles/vehicles.service.ts"; export type B = A;`],
    ["src/features/x/api/a.ts", `import type { A } from "../../../server/lib/clock.ts"; export type B = A;`],
    ["src/features/x/api/a.ts", `export type B = import("../../../../server/modules/vehicles/vehicles.service.ts").A;`],
    ["src/a.ts", `export const B = () => import("../server/modules/x/x.presenter.ts");`],
    ["shared/domain/a.ts", `import type { A } from "../../server/lib/clock.ts"; export type B = A;`],
    ["shared/a.ts", `import { A } from "../src/lib/x.ts"; export const B = A;`],
    ["shared/a.ts", `export type B = import("../server/modules/x/x.presenter.ts").A;`],
    ["server/modules/vehicles/a.ts", `import { A } from "../photos/photos.queries.ts"; export const B = A;`],
    ["server/modules/vehicles/a.ts", `import type { A } from "../photos/photos.queries.ts"; export type B = A;`],
  ])("when %s writes %s, then lint refuses it", async (file, code) => {
    expect(await blocked(file, code)).toHaveLength(1);
  });
});
