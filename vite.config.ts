import { defineConfig } from "vitest/config";
import react from "@vitejs/plugin-react";
import tailwindcss from "@tailwindcss/vite";
import { fileURLToPath } from "node:url";

const here = (p: string) => fileURLToPath(new URL(p, import.meta.url));

const apiPort = Number(process.env.PORT ?? 3000);

export default defineConfig({
  plugins: [react(), tailwindcss()],
  root: here("./src"),
  publicDir: false,
  build: {
    outDir: here("./dist/client"),
    emptyOutDir: true,
    sourcemap: false,
    rollupOptions: {
      output: {
        // Chunks made only of shared/ code carry a "shared-" prefix, so a staff page's chunk is never mistaken for a
        // constants module of the same name (the public-page tests check which chunks load).
        chunkFileNames: (chunk: { moduleIds?: string[] }) =>
          chunk.moduleIds?.length && chunk.moduleIds.every((id) => id.includes("/shared/")) ? "assets/shared-[name]-[hash].js" : "assets/[name]-[hash].js",
      },
    },
  },
  server: {
    host: "127.0.0.1",
    port: 5173,
    proxy: {
      "/api": `http://127.0.0.1:${apiPort}`,
      "/feeds": `http://127.0.0.1:${apiPort}`,
      "/media": `http://127.0.0.1:${apiPort}`,
    },
  },
  test: {
    root: here("."),
    environment: "node",
    globalSetup: [here("./tests/support/global-setup.ts")],
    include: ["tests/**/*.test.ts"],
    testTimeout: 90_000,
    // expect.poll waits for the page or a background worker; 1 s (the default) is too short on a busy 2-core machine.
    expect: { poll: { timeout: 15_000 } },
    hookTimeout: 120_000,
    fileParallelism: true,
    maxWorkers: 2,
  },
});
