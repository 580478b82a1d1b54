import { checkPageResponse } from "@/lib/http/check-page";

// Public: what a poster's QR code opens; plain HTML (lib/editions/check-html.ts), rate-limited per address.
export async function GET(req: Request, { params }: { params: Promise<{ token: string }> }) {
  return checkPageResponse(req, (await params).token);
}
