import { z } from "zod";

/** Check tokens are URL-safe base64 of at least 128 random bits. */
export const checkTokenSchema = z.string().regex(/^[A-Za-z0-9_-]{22,64}$/);
