import { z } from "zod";

// Every setting Ovenward reads, validated once. Defaults make `npm run demo` work on a fresh machine.
const envSchema = z.object({
  NODE_ENV: z.enum(["development", "production", "test"]).default("development"),
  DATABASE_URL: z.string().min(1).default("file:./data/ovenward.db"),
  DATABASE_AUTH_TOKEN: z.string().optional(),
  AUTH_SECRET: z.string().min(16).optional(),
  AUTH_URL: z.string().url().optional(),
  PORT: z.coerce.number().int().positive().default(3000),
  SMTP_URL: z.string().default("smtp://127.0.0.1:2525"),
  SMTP_SINK: z.enum(["on", "off"]).default("off"),
  SMTP_SINK_PORT: z.coerce.number().int().positive().default(2525),
  MAIL_FROM: z.string().default("Ovenward <ovenward@brightwater.example>"),
  /** Shared secret an external cron sends as `Authorization: Bearer …` to POST /api/cron/tick. */
  CRON_SECRET: z.string().min(16).optional(),
  /** The in-process scheduler timer (scripts/serve.mts); off when an external cron drives the tick. */
  SCHEDULER: z.enum(["on", "off"]).default("on"),
  DEMO_MODE: z.enum(["on", "off"]).default("off"),
  DEMO_PASSWORD: z.string().min(8).default("ovenward-demo"),
  /** Where uploaded files go: a local folder (UPLOAD_DIR) or an S3-compatible bucket (S3_*). */
  STORAGE: z.enum(["local", "s3"]).default("local"),
  UPLOAD_DIR: z.string().default("./data/uploads"),
  /** Requests per minute one API token may make (a token bucket of that size); 0 turns the limit off. */
  API_RATE_LIMIT_PER_MINUTE: z.coerce.number().int().min(0).default(600),
  /** Failed password sign-ins plus magic-link requests per client address per 15 minutes; 0 turns it off. */
  SIGN_IN_RATE_LIMIT: z.coerce.number().int().min(0).default(30),
  /** Reverse proxies in front of the app that append to X-Forwarded-For; the client address is that many entries from the right. */
  TRUSTED_PROXY_HOPS: z.coerce.number().int().min(1).max(10).default(1),
  S3_BUCKET: z.string().min(3).optional(),
  /** Empty for AWS itself; the URL of any other S3-compatible service. */
  S3_ENDPOINT: z.string().url().optional(),
  S3_REGION: z.string().min(1).default("us-east-1"),
  /** Both or neither; without them the AWS SDK's own chain (environment, instance role…) applies. */
  S3_ACCESS_KEY_ID: z.string().min(1).optional(),
  S3_SECRET_ACCESS_KEY: z.string().min(1).optional(),
  /** Most self-hosted S3-compatible servers want bucket-in-path URLs. */
  S3_FORCE_PATH_STYLE: z.enum(["on", "off"]).default("off"),
  /** Keys go under this folder of the bucket, e.g. `ovenward/`. */
  S3_PREFIX: z.string().regex(/^((?!\.\.?\/)[\w.-]+\/)*$/, "folders of letters, digits, '.', '-' or '_' (not '.' or '..'), each ending in '/'").default(""),
}).superRefine((e, ctx) => {
  if (e.STORAGE === "s3" && !e.S3_BUCKET) ctx.addIssue({ code: "custom", path: ["S3_BUCKET"], message: "is required when STORAGE=s3" });
  if (!e.S3_ACCESS_KEY_ID !== !e.S3_SECRET_ACCESS_KEY) {
    ctx.addIssue({ code: "custom", path: [e.S3_ACCESS_KEY_ID ? "S3_SECRET_ACCESS_KEY" : "S3_ACCESS_KEY_ID"], message: "set S3_ACCESS_KEY_ID and S3_SECRET_ACCESS_KEY together" });
  }
});

export type Env = z.infer<typeof envSchema>;

// Parsed again only when one of its variables changes (tests and scripts set them after some
// module has already read the settings; a stale copy would point at another database).
const KEYS = Object.keys(envSchema.shape) as (keyof Env)[];
let cached: { key: string; env: Env } | undefined;

export function env(): Env {
  const key = KEYS.map((k) => process.env[k] ?? "\u0000").join("\u0001");
  if (cached?.key !== key) {
    const parsed = envSchema.safeParse(process.env);
    if (!parsed.success) {
      const fields = parsed.error.issues.map((i) => `${i.path.join(".")}: ${i.message}`).join("; ");
      throw new Error(`Ovenward's configuration is invalid (${fields}). See .env.example.`);
    }
    cached = { key, env: parsed.data };
  }
  return cached.env;
}

export function appUrl(): string {
  return env().AUTH_URL ?? `http://localhost:${env().PORT}`;
}
