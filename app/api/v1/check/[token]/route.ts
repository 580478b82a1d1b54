import { getCheckByToken } from "@/db/queries/check";
import { route } from "@/lib/auth/guard";
import { checkJson } from "@/lib/editions/check-json";
import { notFound } from "@/lib/errors";
import { checkTokenSchema } from "@/lib/validation/check";

// Public: the QR code on a poster opens this for anyone, signed in or not.
export const GET = route<{ token: string }>(async (_req, { token }) => {
  if (!checkTokenSchema.safeParse(token).success) throw notFound("Check");
  const view = await getCheckByToken({ token });
  if (!view) throw notFound("Check");
  return Response.json(checkJson(view), { headers: { "cache-control": "no-store" } });
});
