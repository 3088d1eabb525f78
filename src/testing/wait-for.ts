/**
 * Polls until `probe` returns something (or throws after ~1 s of macrotasks). For steps that leave
 * Angular, like FileReader, where whenStable() has nothing to wait for.
 */
export async function waitFor<T>(probe: () => T | null | undefined | false, what: string): Promise<T> {
  for (let attempt = 0; attempt < 100; attempt++) {
    const found = probe();
    if (found) return found;
    await new Promise((resolve) => setTimeout(resolve, 10));
  }
  throw new Error(`Timed out waiting for ${what}`);
}
