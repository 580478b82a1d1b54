import type { EditionStatus } from "@/lib/editions/states";

export const checkUrlFor = (appUrl: string, token: string) => `${appUrl}/v/${token}`;
export const pdfUrlFor = (appUrl: string, editionId: number) => `${appUrl}/api/v1/editions/${editionId}/pdf`;

/** URLs of an edition, built from the configured APP_URL (the QR code encodes checkUrl). */
export function editionUrls(appUrl: string, edition: { id: number; checkToken: string }) {
  return { checkUrl: checkUrlFor(appUrl, edition.checkToken), pdfUrl: pdfUrlFor(appUrl, edition.id) };
}

export type EditionSummary = {
  id: number;
  number: number;
  status: EditionStatus;
  fingerprint: string;
  checkUrl: string;
  pdfUrl: string;
  approvedAt: string | null;
  approvedBy: string | null;
};

export function editionSummary(
  appUrl: string,
  e: {
    id: number;
    number: number;
    status: EditionStatus;
    fingerprint: string;
    checkToken: string;
    approvedAt: Date | null;
    approvedByName: string | null;
  },
): EditionSummary {
  return {
    id: e.id,
    number: e.number,
    status: e.status,
    fingerprint: e.fingerprint,
    ...editionUrls(appUrl, e),
    approvedAt: e.approvedAt ? e.approvedAt.toISOString() : null,
    approvedBy: e.approvedByName,
  };
}
