// Bump when the poster layout or drawing changes: cached renders are keyed by it.
export const POSTER_RENDERER_VERSION = 10;
