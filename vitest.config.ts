import path from "node:path";
import { defineConfig } from "vitest/config";

const alias = {
  "@": path.resolve(import.meta.dirname),
  "server-only": path.resolve(import.meta.dirname, "tests/support/server-only.ts"),
};

export default defineConfig({
  resolve: { alias },
  test: {
    projects: [
      {
        resolve: { alias },
        test: { name: "unit", environment: "node", include: ["tests/unit/**/*.test.ts"] },
      },
      {
        // Tests that start external programs (poppler's pdftoppm/pdftotext/pdfinfo, zbarimg, a
        // second Node process): slower, and they need the Debian tools installed.
        resolve: { alias },
        test: { name: "tools", environment: "node", include: ["tests/tools/**/*.test.ts"], testTimeout: 60_000 },
      },
      {
        resolve: { alias },
        test: {
          name: "integration",
          environment: "node",
          include: ["tests/integration/**/*.test.ts"],
          setupFiles: ["tests/integration/setup.ts"],
          // next-auth imports "next/server" without an extension; let Vite resolve it.
          server: { deps: { inline: [/next-auth/] } },
          fileParallelism: false,
          testTimeout: 30_000,
          hookTimeout: 60_000,
        },
      },
    ],
  },
});
