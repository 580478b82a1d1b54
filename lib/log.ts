import "server-only";
import pino from "pino";
import { env } from "@/lib/env";

/** The one logger: JSON lines on stdout, secrets redacted wherever they appear. */
export const logger = pino({
  level: env.LOG_LEVEL,
  base: undefined,
  redact: {
    paths: ["password", "*.password", "token", "*.token", "cookie", "*.cookie", "authorization"],
    censor: "[redacted]",
  },
});
