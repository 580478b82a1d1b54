// `npx tsx tests/bench/logo-bombs.ts`: how long checkLogo takes to answer the image bombs of
// the hardening probe, and how late a 1 ms timer fires meanwhile (the event loop's stall, which
// is what every other request waits for). Prints figures; the outcomes are asserted in
// tests/unit/logo.test.ts.
import { performance } from "node:perf_hooks";
import { PNG } from "pngjs";
import { checkLogo } from "@/lib/logo";
import { craftPng } from "../support/image-bombs";

async function measure(name: string, bytes: Buffer) {
  let worstLag = 0;
  let last = performance.now();
  const timer = setInterval(() => {
    const now = performance.now();
    worstLag = Math.max(worstLag, now - last - 1);
    last = now;
  }, 1);
  const t0 = performance.now();
  const outcome = await checkLogo(bytes).then(
    (c) => `accepted ${c.width}x${c.height}`,
    (e: Error) => `refused: ${e.message.slice(0, 60)}`,
  );
  const ms = performance.now() - t0;
  await new Promise((r) => setTimeout(r, 5));
  clearInterval(timer);
  console.log(
    `${name.padEnd(44)} ${(bytes.length / 1024).toFixed(1).padStart(8)} KB ${ms.toFixed(1).padStart(8)} ms  worst loop stall ${worstLag.toFixed(1).padStart(6)} ms  ${outcome}`,
  );
}

const honest = new PNG({ width: 2000, height: 2000 });
honest.data.fill(180);
const cases: [string, Buffer][] = [
  ["8000x8000 declared, 64 KB of real rows", await craftPng({ width: 8000, height: 8000 }, 64 * 1024)],
  ["8000x8000 whole (256 MB inflated)", await craftPng({ width: 8000, height: 8000 })],
  [
    "interlaced 1000x1000 inflating to 512 MB",
    await craftPng({ width: 1000, height: 1000, interlaced: true }, 512 * 1024 * 1024),
  ],
  ["4000x4000 16-bit RGBA (128 MB inflated)", await craftPng({ width: 4000, height: 4000, bitDepth: 16 })],
  [
    "2000x1000 16-bit interlaced (accepted)",
    await craftPng({ width: 2000, height: 1000, bitDepth: 16, interlaced: true }),
  ],
  ["2000x2000 RGBA 8-bit, pngjs-encoded (accepted)", PNG.sync.write(honest)],
];
console.log("case                                          file size     time  event loop");
for (const [name, bytes] of cases) await measure(name, bytes);
