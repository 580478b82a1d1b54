// Text shaping dominates a poster render: fontkit runs Inter's OpenType lookups (GSUB/GPOS) for
// every text run, and a poster repeats the same few strings hundreds of times ("3.25", "(3.05)",
// headings). Profiling the bench's A1 poster put over half the render in fontkit's lookups. The
// shaped glyph run of a string depends only on the font, the string, the features and the
// direction, and textkit never mutates it (it maps positions into new objects), so one shaping
// per distinct string is kept per font.
import { readFileSync } from "node:fs";
import * as fontkit from "fontkit";

type GlyphRun = unknown;
type Layout = (this: object, s: string, f?: unknown, script?: string, lang?: string, dir?: string) => GlyphRun;

const MAX_ENTRIES_PER_FONT = 20_000;
let installed = false;

/** Wraps fontkit's TTF layout with a per-font cache; `fontFile` names any TrueType font of the family. */
export function installShapingCache(fontFile: string): void {
  if (installed) return;
  const sample = fontkit.create(readFileSync(fontFile)) as unknown as object;
  const proto = Object.getPrototypeOf(sample) as { layout: Layout };
  const original = proto.layout;
  const caches = new WeakMap<object, Map<string, GlyphRun>>();
  proto.layout = function cachedLayout(string, features, script, language, direction) {
    // Only the calls react-pdf's textkit makes (no script or language) are cached.
    if (script !== undefined || language !== undefined || typeof string !== "string")
      return original.call(this, string, features, script, language, direction);
    let cache = caches.get(this);
    if (!cache) caches.set(this, (cache = new Map()));
    const key = `${direction ?? ""}\u0000${JSON.stringify(features ?? null)}\u0000${string}`;
    let run = cache.get(key);
    if (run === undefined) {
      run = original.call(this, string, features, script, language, direction);
      if (cache.size >= MAX_ENTRIES_PER_FONT) cache.clear();
      cache.set(key, run);
    }
    return run;
  };
  installed = true;
}
