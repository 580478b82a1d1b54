import { shortCodeReply, toResponse } from "@/lib/http/check-page";

// Public: the short code typed from under a poster's QR code; redirects to the check page.
export async function GET(req: Request, { params }: { params: Promise<{ code: string }> }) {
  return toResponse(await shortCodeReply(req.headers, (await params).code));
}
