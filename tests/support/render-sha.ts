// Renders an illustrative poster in a fresh process and prints its SHA-256 (determinism test).
import { createHash } from "node:crypto";
import { renderPosterPdf } from "@/lib/poster/pdf/render";
import { posterInput, potDefinition, snapshotOf } from "./poster-fixtures";

const pdf = await renderPosterPdf(posterInput(snapshotOf(potDefinition)));
console.log(createHash("sha256").update(pdf).digest("hex"));
