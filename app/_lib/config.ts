import { z } from "zod";

// Runtime settings from the environment (documented in .env.example), validated once.
const envSchema = z.object({
  APP_URL: z.url().default("http://127.0.0.1:3000"),
  MAIL_FROM: z.string().min(3).default("Loopwright <no-reply@loopwright.invalid>"),
  SMTP_HOST: z.string().default("127.0.0.1"),
  SMTP_PORT: z.coerce.number().int().positive().default(2525),
  SMTP_SECURE: z.enum(["true", "false"]).default("false"),
  SMTP_USER: z.string().optional(),
  SMTP_PASSWORD: z.string().optional(),
  MAILBOX_ENABLED: z.enum(["true", "false"]).default("false"),
  TRUSTED_PROXY_HOPS: z.coerce.number().int().min(0).max(5).default(0),
});

export type AppConfig = z.infer<typeof envSchema>;

export function appConfig(): AppConfig {
  const parsed = envSchema.safeParse(process.env);
  if (!parsed.success) {
    throw new Error(`Invalid environment: ${parsed.error.issues.map((i) => `${i.path.join(".")}: ${i.message}`).join("; ")}`);
  }
  return parsed.data;
}

export const isHttpsApp = () => appConfig().APP_URL.startsWith("https://");
export const mailboxEnabled = () => appConfig().MAILBOX_ENABLED === "true";
