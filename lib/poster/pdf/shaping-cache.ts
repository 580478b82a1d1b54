// Text shaping dominates a poster render: fontkit runs Inter's OpenType lookups (GSUB/GPOS) for
// every text run, and a poster repeats the same few strings hundreds of times ("3.25", "(3.05)",
// headings). Profiling the bench's A1 poster put over half the render in fontkit's lookups. The
// shaped glyph run of a string depends only on the font, the string, the features and the
// direction, so one shaping per distinct string is kept per font. Callers may change what they
// get (pdfkit scales a run's positions in place when it draws), so each call gets its own copy.
//
// The cache is put on the class of a font react-pdf itself loaded, never on a fontkit imported
// here: a server bundle may hold its own copy of fontkit, whose class react-pdf never uses.

type GlyphRun = unknown;
type Layout = (this: object, s: string, f?: unknown, script?: string, lang?: string, dir?: string) => GlyphRun;

const copyOf = <T extends object>(o: T): T => Object.assign(Object.create(Object.getPrototypeOf(o) as object) as T, o);
/** A fresh run over fresh positions: pdfkit scales a run's positions in place. */
const copyRun = (run: GlyphRun): GlyphRun => {
  const r = copyOf(run as { positions: object[] });
  r.positions = r.positions.map(copyOf);
  return r;
};

const MAX_ENTRIES_PER_FONT = 20_000;
let installed = false;

/** Wraps fontkit's layout with a per-font cache, on the class of `loadedFont` (a fontkit font). */
export function installShapingCache(loadedFont: object): void {
  if (installed) return;
  const proto = Object.getPrototypeOf(loadedFont) as { layout: Layout };
  const original = proto.layout;
  const caches = new WeakMap<object, Map<string, GlyphRun>>();
  proto.layout = function cachedLayout(string, features, script, language, direction) {
    // Only the calls react-pdf and pdfkit make (no script or language) are cached.
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
    return copyRun(run);
  };
  installed = true;
}
