import type { Metadata, Viewport } from "next";
import { ServiceWorker } from "@/components/offline/service-worker";
import { SiteHeader } from "@/components/shell/site-header";
import { preload } from "react-dom";
import "./globals.css";

export const metadata: Metadata = {
  title: { default: "Forkwall", template: "%s · Forkwall" },
  description:
    "Bifurcation balloon-sizing wall charts built from your cath lab's own stock, with live checks for every printed copy.",
  manifest: "/manifest.webmanifest",
  icons: {
    icon: [
      { url: "/icon.svg", type: "image/svg+xml" },
      { url: "/icon-192.png", sizes: "192x192", type: "image/png" },
    ],
    apple: [{ url: "/apple-icon-180.png", sizes: "180x180" }],
  },
  appleWebApp: { capable: true, title: "Forkwall", statusBarStyle: "default" },
};

export const viewport: Viewport = { width: "device-width", initialScale: 1, themeColor: "#164f5d" };

export default function RootLayout({ children }: { children: React.ReactNode }) {
  // Every page sets its text in the regular weight; bold and semibold load when a page uses them.
  preload("/fonts/inter-400.woff2", { as: "font", type: "font/woff2", crossOrigin: "anonymous" });
  return (
    <html lang="en">
      <body className="min-h-screen bg-paper font-sans text-ink antialiased">
        <a
          href="#main"
          className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:rounded focus:bg-white focus:px-3 focus:py-2"
        >
          Skip to content
        </a>
        <SiteHeader />
        <ServiceWorker />
        <main id="main" className="mx-auto w-full max-w-page px-3 py-3 sm:px-gutter sm:py-8">
          {children}
        </main>
      </body>
    </html>
  );
}
