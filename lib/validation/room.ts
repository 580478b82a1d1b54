import { z } from "zod";
import { idParam } from "./edition";

export const roomSchema = z
  .object({ name: z.string().trim().min(1, "Give the room a name").max(120, "Keep the name under 120 characters") })
  .strict();

export const postingSchema = z.object({ roomId: idParam }).strict();
