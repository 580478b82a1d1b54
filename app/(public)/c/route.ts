import { shortCodeReply, toResponse } from "@/lib/http/check-page";

// Public: the code typed again into the "No printout has this code" form (/c?code=...).
export async function GET(req: Request) {
  return toResponse(await shortCodeReply(req.headers, new URL(req.url).searchParams.get("code") ?? ""));
}
