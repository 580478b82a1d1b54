import type { FakeMessage } from "./fake-server";

const same = (a: string, b: string) => a.trim().toLowerCase() === b.trim().toLowerCase();

/** The messages the local mail fake holds that were delivered to `address`, newest first. */
export function mailFor(messages: readonly FakeMessage[], address: string): FakeMessage[] {
  return messages.filter((m) => m.envelopeTo.some((to) => same(to, address))).reverse();
}
