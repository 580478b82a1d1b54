import { createElement, type ReactElement } from "react";
import { renderToBuffer, type DocumentProps } from "@react-pdf/renderer";
import { CardDocument } from "./card";
import { PosterDocument, preparePosterFonts, type PosterInput } from "./document";

/**
 * The poster PDF for one edition. Deterministic: the same input gives the same bytes (metadata
 * dates come from the approval date or a fixed epoch, and pdfkit derives the document /ID from
 * that metadata), so a stored render can be checked by its hash.
 */
export async function renderPosterPdf(input: PosterInput): Promise<Buffer> {
  await preparePosterFonts();
  const doc = createElement(PosterDocument, { input }) as unknown as ReactElement<DocumentProps>;
  return renderToBuffer(doc);
}

/** The two-sided badge card (ISO/IEC 7810 ID-1) of an edition; deterministic like the poster. */
export async function renderCardPdf(input: PosterInput): Promise<Buffer> {
  await preparePosterFonts();
  const doc = createElement(CardDocument, { input }) as unknown as ReactElement<DocumentProps>;
  return renderToBuffer(doc);
}
