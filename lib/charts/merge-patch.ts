type Json = unknown;

const isPlainObject = (v: Json): v is Record<string, Json> => v !== null && typeof v === "object" && !Array.isArray(v);

/**
 * A partial change applied to a stored definition: objects merge key by key, so a field left out
 * keeps its value (`{"law":{"law":"finet"}}` keeps the ratio); arrays and plain values replace.
 * Like JSON Merge Patch (RFC 7396), except that null is a value here (e.g. "no stent platform").
 */
export function mergePatch<T>(target: T, patch: Json): T {
  if (!isPlainObject(patch) || !isPlainObject(target)) return patch as T;
  const out: Record<string, Json> = { ...target };
  for (const [key, value] of Object.entries(patch)) out[key] = mergePatch(out[key], value);
  return out as T;
}
