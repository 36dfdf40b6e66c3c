import { z } from "zod";

const bool = z
  .enum(["true", "false", "1", "0", "yes", "no"])
  .transform((v) => v === "true" || v === "1" || v === "yes");

/** The environment, parsed once at boot. A bad value stops the process with a message naming the variable. */
export const configSchema = z.object({
  NODE_ENV: z.enum(["development", "production", "test"]).default("development"),
  HOST: z.string().default("127.0.0.1"),
  PORT: z.coerce.number().int().min(0).max(65535).default(3000),
  DATABASE_URL: z.string().regex(/^mysql:\/\//, "must be a mysql:// URL"),
  PUBLIC_URL: z.url().optional(),
  DEMO_PASSWORD: z.string().min(12).default("forthright-demo"),
  LOG_LEVEL: z.enum(["fatal", "error", "warn", "info", "debug", "trace", "silent"]).default("info"),
  TRUST_PROXY: bool.default(false),
  UPLOADS_DIR: z.string().default("uploads"),
  SESSION_DAYS: z.coerce.number().int().min(1).max(90).default(30),
});

export type Config = z.infer<typeof configSchema> & { publicUrl: string; production: boolean };

export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const parsed = configSchema.safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join(".")}: ${i.message}`);
    throw new Error(`Configuration is not valid:\n${lines.join("\n")}`);
  }
  const c = parsed.data;
  return {
    ...c,
    publicUrl: (c.PUBLIC_URL ?? `http://${c.HOST === "0.0.0.0" ? "127.0.0.1" : c.HOST}:${c.PORT}`).replace(/\/$/, ""),
    production: c.NODE_ENV === "production",
  };
}
