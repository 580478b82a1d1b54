// How much one stock import may carry.
import { ONE_MB } from "@/lib/upload-limits";

export const MAX_IMPORT_BYTES = ONE_MB;
export const MAX_IMPORT_ROWS = 5000;
