// Upload limits and how the UI says them: pure, so a form shows the limit the server enforces.
export const ONE_MB = 1024 * 1024;

/** A lab logo (PNG or JPEG) printed on posters. */
export const LOGO_MAX_BYTES = ONE_MB;
export const LOGO_TOO_LARGE_HINT = "Use a smaller PNG or JPEG.";

/** Room for the multipart boundaries and part headers around a file at its limit. */
export const ENVELOPE_BYTES = 64 * 1024;

/** 1048576 -> "1", 1572864 -> "1.50" (megabytes of 1024 × 1024 bytes). */
export const megabytes = (n: number) => (n % ONE_MB === 0 ? String(n / ONE_MB) : (n / ONE_MB).toFixed(2));

/** What a refused file hears, from the server or from a form that checks before sending. */
export const tooLargeMessage = (bytes: number, maxBytes: number, hint: string) =>
  `The file is ${megabytes(bytes)} MB; the limit is ${megabytes(maxBytes)} MB (${maxBytes.toLocaleString("en")} bytes). ${hint}`;
