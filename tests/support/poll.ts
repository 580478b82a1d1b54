/**
 * Polls `read` until `done` holds for its value, then returns it; throws naming `what` after
 * `timeoutMs`. For things that happen after a response (e-mail, a process dying), instead of a sleep.
 */
export async function until<T>(
  what: string,
  read: () => Promise<T>,
  done: (value: T) => boolean,
  { timeoutMs = 15_000, everyMs = 100 } = {},
): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const value = await read();
    if (done(value)) return value;
    if (Date.now() > deadline) throw new Error(`timed out after ${timeoutMs} ms waiting for ${what}`);
    await new Promise((r) => setTimeout(r, everyMs));
  }
}
