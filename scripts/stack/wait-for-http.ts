/** Polls url until it answers 200. Gives up after timeoutMs with the last thing it saw. */
export async function waitForHttpOk(url: string, timeoutMs: number): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  let last = 'no answer yet';
  while (Date.now() < deadline) {
    try {
      const response = await fetch(url, { signal: AbortSignal.timeout(2000) });
      await response.arrayBuffer();
      if (response.status === 200) return;
      last = `HTTP ${response.status}`;
    } catch (error) {
      last = (error as Error).cause instanceof Error ? ((error as Error).cause as Error).message : (error as Error).message;
    }
    await new Promise((resolve) => setTimeout(resolve, 250));
  }
  throw new Error(`${url} did not answer 200 within ${Math.round(timeoutMs / 1000)} s (last: ${last})`);
}
