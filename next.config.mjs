import { securityHeaders } from "./lib/http/security-headers.mjs";

const isDev = process.env.NODE_ENV !== "production";

/** @type {import('next').NextConfig} */
const nextConfig = {
  // Tests build into their own folder so a running `npm start` keeps its build.
  distDir: process.env.NEXT_DIST_DIR || ".next",
  poweredByHeader: false,
  experimental: {
    // The largest file a form sends (a 1 MB stock CSV or logo: lib/stock/limits.ts, lib/upload-limits.ts)
    // plus 64 KB of multipart envelope; tests/unit/upload-limits.test.ts keeps the two in step.
    serverActions: { bodySizeLimit: 1024 * 1024 + 64 * 1024 },
  },
  reactStrictMode: true,
  async headers() {
    return [
      {
        source: "/:path*",
        headers: securityHeaders(isDev),
      },
      // JSON answers can hold a lab's data: no shared or browser cache keeps them. A handler that
      // sets its own Cache-Control (logos, poster PDFs) keeps it.
      ...["/api/v1/:path*", "/api/auth/session"].map((source) => ({
        source,
        headers: [{ key: "Cache-Control", value: "private, no-store" }],
      })),
    ];
  },
};

export default nextConfig;
