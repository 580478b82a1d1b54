import { createElement, type ReactElement } from "react";
import { renderToBuffer, type DocumentProps } from "@react-pdf/renderer";
import { PosterDocument, registerPosterFonts, type PosterInput } from "./document";

/**
 * The poster PDF for one edition. Deterministic: the same input gives the same bytes (metadata
 * dates come from the approval date or a fixed epoch, and pdfkit derives the document /ID from
 * that metadata), so a stored render can be checked by its hash.
 */
export async function renderPosterPdf(input: PosterInput): Promise<Buffer> {
  registerPosterFonts();
  const doc = createElement(PosterDocument, { input }) as unknown as ReactElement<DocumentProps>;
  return renderToBuffer(doc);
}
