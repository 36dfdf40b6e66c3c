/**
 * The project's one seeded PRNG (mulberry32, the demo's drawings use it too), returning floats in [0, 1), so generated
 * data, query mixes and kill times repeat run to run.
 */
export { rng as seededRandom } from "../../server/demo/art/palette.ts";
