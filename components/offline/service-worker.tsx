"use client";

import { usePathname } from "next/navigation";
import { useEffect } from "react";

/** Registers public/sw.js and asks it to keep this page and the files it loaded for offline reading. */
export function ServiceWorker() {
  const pathname = usePathname();
  useEffect(() => {
    if (!("serviceWorker" in navigator) || !navigator.onLine) return;
    let live = true;
    navigator.serviceWorker
      .register("/sw.js", { scope: "/" })
      .then(() => navigator.serviceWorker.ready)
      .then((reg) => {
        if (!live) return;
        const files = performance
          .getEntriesByType("resource")
          .map((e) => e.name)
          .filter((u) => u.startsWith(location.origin));
        reg.active?.postMessage({ type: "keep", urls: [location.href, ...files] });
      })
      .catch(() => undefined);
    return () => {
      live = false;
    };
  }, [pathname]);
  return null;
}

/** Tells the service worker to drop the kept pages (the person signed out). */
export function forgetOfflinePages() {
  navigator.serviceWorker?.controller?.postMessage({ type: "forget" });
}
