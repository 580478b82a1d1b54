import { checkPageReply, toResponse } from "@/lib/http/check-page";

// Public: what a poster's QR code opens; plain HTML (lib/editions/check-html.ts), rate-limited per
// address. server.mjs answers anonymous scans itself (lib/http/direct.ts); Next serves the rest.
export async function GET(req: Request, { params }: { params: Promise<{ token: string }> }) {
  return toResponse(await checkPageReply(req.headers, (await params).token));
}
