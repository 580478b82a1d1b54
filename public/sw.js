// Forkwall's service worker: the calculator and the wall views a person opened stay readable
// offline. Only GET requests for those pages and for hashed static files are ever answered from
// the cache; everything else (every write, every API call, the check pages) goes to the network.
const PAGES = "forkwall-pages-v1";
const STATIC = "forkwall-static-v1";
const FETCHED_AT = "x-forkwall-fetched-at";

/** Pages kept for offline reading: the calculator, a lab's wall-chart list and each wall view. */
function keptPage(pathname) {
  return (
    pathname === "/calculator" ||
    /^\/labs\/[^/]+\/wall$/.test(pathname) ||
    /^\/labs\/[^/]+\/charts\/\d+\/wall$/.test(pathname)
  );
}
/** Files whose name changes with their content, safe to serve from the cache for ever. */
function staticFile(pathname) {
  return pathname.startsWith("/_next/static/") || pathname.startsWith("/fonts/") || pathname === "/icon.svg";
}
const checkPage = (pathname) => /^\/(v|c)(\/|$)/.test(pathname);

const CANNOT_VERIFY = `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1"><title>Cannot be verified now · Forkwall</title></head>
<body style="margin:0;font:1rem/1.5 system-ui,sans-serif;color:#17212b;background:#f7f8f6"><main style="max-width:40rem;margin:0 auto;padding:1rem">
<h1 style="font-size:1.6rem;line-height:1.2">This printout cannot be verified now</h1>
<p data-testid="check-offline">This phone is offline, so whether the printout is still current cannot be checked. Until it is verified, do not rely on its numbers.</p>
</main></body></html>`;

async function store(url) {
  const res = await fetch(url, { credentials: "same-origin", cache: "no-store" });
  if (!res.ok || res.redirected) return;
  const body = await res.blob();
  const headers = new Headers(res.headers);
  headers.set(FETCHED_AT, new Date().toISOString());
  await (await caches.open(PAGES)).put(url, new Response(body, { status: 200, headers }));
}

self.addEventListener("install", () => self.skipWaiting());
self.addEventListener("activate", (event) => event.waitUntil(self.clients.claim()));

self.addEventListener("message", (event) => {
  const data = event.data || {};
  if (data.type === "keep" && Array.isArray(data.urls)) {
    event.waitUntil(
      Promise.all(
        data.urls.map(async (u) => {
          const url = new URL(u, self.location.origin);
          if (url.origin !== self.location.origin) return;
          if (keptPage(url.pathname)) await store(url.origin + url.pathname).catch(() => undefined);
          else if (staticFile(url.pathname))
            await caches
              .open(STATIC)
              .then((c) => c.add(url.href))
              .catch(() => undefined);
        }),
      ),
    );
  }
  // Signed out: what the person's labs showed leaves this device.
  if (data.type === "forget")
    event.waitUntil(
      caches.open(PAGES).then(async (c) => {
        for (const req of await c.keys()) if (new URL(req.url).pathname.startsWith("/labs/")) await c.delete(req);
      }),
    );
});

self.addEventListener("fetch", (event) => {
  const req = event.request;
  if (req.method !== "GET") return;
  const url = new URL(req.url);
  if (url.origin !== self.location.origin || url.search.includes("_rsc")) return;
  if (staticFile(url.pathname)) {
    event.respondWith(
      caches.match(req).then(
        (hit) =>
          hit ||
          fetch(req).then((res) => {
            if (res.ok) {
              const copy = res.clone();
              event.waitUntil(caches.open(STATIC).then((c) => c.put(req, copy)));
            }
            return res;
          }),
      ),
    );
    return;
  }
  if (req.mode !== "navigate") return;
  if (checkPage(url.pathname)) {
    event.respondWith(
      fetch(req).catch(
        () => new Response(CANNOT_VERIFY, { status: 503, headers: { "content-type": "text/html; charset=utf-8" } }),
      ),
    );
    return;
  }
  if (!keptPage(url.pathname)) return;
  // Network first: the cache answers only when the network cannot.
  event.respondWith(
    fetch(req)
      .then((res) => {
        if (res.ok && !res.redirected) {
          const copy = res.clone();
          event.waitUntil(
            copy.blob().then(async (body) => {
              const headers = new Headers(copy.headers);
              headers.set(FETCHED_AT, new Date().toISOString());
              await (
                await caches.open(PAGES)
              ).put(url.origin + url.pathname, new Response(body, { status: 200, headers }));
            }),
          );
        }
        return res;
      })
      .catch(async () => (await caches.match(url.origin + url.pathname, { cacheName: PAGES })) || Response.error()),
  );
});
