import { z } from "zod";
import { freeText } from "./text";
import { idSchema } from "./id";

export const roomSchema = z
  .object({
    name: freeText({
      what: "Room name",
      min: 1,
      max: 120,
      minMessage: "Give the room a name",
      maxMessage: "Keep the name under 120 characters",
    }),
  })
  .strict();

export const postingSchema = z.object({ roomId: idSchema }).strict();
