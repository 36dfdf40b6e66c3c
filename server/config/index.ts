import { z } from "zod";

const bool = z
  .enum(["true", "false", "1", "0", "yes", "no"])
  .transform((v) => v === "true" || v === "1" || v === "yes");

/** An http(s) origin written alone: scheme, host and optional port, at most a trailing slash after it. */
function isOrigin(value: string): boolean {
  try {
    const url = new URL(value);
    const bare = url.pathname === "/" && !/[?#]/.test(value) && !url.username && !url.password;
    return (url.protocol === "http:" || url.protocol === "https:") && bare;
  } catch {
    return false;
  }
}

/** A comma list of origins, each normalised as URL.origin writes it. */
const originList = z
  .string()
  .transform((v) => v.split(",").map((o) => o.trim()).filter(Boolean))
  .pipe(z.array(z.string().refine(isOrigin, "each entry must be an origin only (scheme, host and port), like https://cars.example").transform((o) => new URL(o).origin)));

/** The environment, parsed once at boot. A bad value stops the process with a message naming the variable. */
export const configSchema = z.object({
  NODE_ENV: z.enum(["development", "production", "test"]).default("development"),
  HOST: z.string().default("127.0.0.1"),
  PORT: z.coerce.number().int().min(0).max(65535).default(3000),
  DATABASE_URL: z.string().regex(/^mysql:\/\//, "must be a mysql:// URL"),
  PUBLIC_URL: z.url().optional(),
  /** Further origins whose pages may write to the API (another hostname of the same site); PUBLIC_URL's is always one. */
  ALLOWED_ORIGINS: originList.default([]),
  DEMO_PASSWORD: z.string().min(12).default("forthright-demo"),
  LOG_LEVEL: z.enum(["fatal", "error", "warn", "info", "debug", "trace", "silent"]).default("info"),
  TRUST_PROXY: bool.default(false),
  UPLOADS_DIR: z.string().default("uploads"),
  SESSION_DAYS: z.coerce.number().int().min(1).max(90).default(30),
  /** Outgoing mail. Without SMTP_HOST outside production, a local fake SMTP server captures every message. */
  SMTP_HOST: z.string().optional(),
  SMTP_PORT: z.coerce.number().int().min(1).max(65535).default(587),
  SMTP_USER: z.string().optional(),
  SMTP_PASS: z.string().optional(),
  SMTP_SECURE: bool.default(false),
  MAIL_FROM: z.string().default("Forthright <no-reply@forthright.invalid>"),
  FAKE_SMTP_PORT: z.coerce.number().int().min(0).max(65535).default(2526),
});

export type Config = z.infer<typeof configSchema> & { publicUrl: string; allowedOrigins: string[]; production: boolean; demoMail: boolean };

export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const parsed = configSchema.safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join(".")}: ${i.message}`);
    throw new Error(`Configuration is not valid:\n${lines.join("\n")}`);
  }
  const c = parsed.data;
  if (c.NODE_ENV === "production" && !c.SMTP_HOST) throw new Error("Configuration is not valid:\n  SMTP_HOST: required in production (mail is never faked there)");
  const publicUrl = (c.PUBLIC_URL ?? `http://${c.HOST === "0.0.0.0" ? "127.0.0.1" : c.HOST}:${c.PORT}`).replace(/\/$/, "");
  return {
    ...c,
    publicUrl,
    // Writes are accepted from these origins only (server/middleware/origin-check.ts).
    allowedOrigins: [...new Set([new URL(publicUrl).origin, ...c.ALLOWED_ORIGINS])],
    production: c.NODE_ENV === "production",
    demoMail: c.NODE_ENV !== "production" && !c.SMTP_HOST,
  };
}
