import { getCheckByToken } from "@/db/queries/check";
import { route } from "@/lib/auth/guard";
import { limitPublic } from "@/lib/auth/public-limit";
import { addressOf } from "@/lib/auth/request-address";
import { checkJson } from "@/lib/editions/check-json";
import { notFound } from "@/lib/errors";
import { checkTokenSchema } from "@/lib/validation/check";

// Public: the QR code on a poster opens this for anyone, signed in or not.
export const GET = route<{ token: string }>(async (req, { token }) => {
  await limitPublic("check", addressOf(req.headers));
  if (!checkTokenSchema.safeParse(token).success) throw notFound("Check");
  const view = await getCheckByToken({ token });
  if (!view) throw notFound("Check");
  return Response.json(checkJson(view), { headers: { "cache-control": "no-store" } });
});
