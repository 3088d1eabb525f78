// How a fake service talks to the orchestrator: it announces readiness over IPC (or prints it when
// run by hand), and it shuts down on SIGTERM/SIGINT or as soon as the orchestrator's IPC channel
// closes, which also happens when the orchestrator was killed with SIGKILL: no orphans on our ports.

export function announceReady(name: string, info: Record<string, unknown>): void {
  if (process.send) process.send({ type: 'ready', ...info });
  else console.log(`${name} ready ${JSON.stringify(info)}`);
}

export function onStop(close: (reason: string) => Promise<void>): void {
  let stopping = false;
  const stop = (reason: string) => {
    if (stopping) return;
    stopping = true;
    // A hung close must not keep the port: give it a few seconds, then leave anyway.
    const timer = setTimeout(() => process.exit(0), 5000);
    timer.unref();
    close(reason)
      .catch((error: unknown) => console.error(`error while stopping: ${error instanceof Error ? error.message : String(error)}`))
      .finally(() => process.exit(0));
  };
  process.on('SIGTERM', () => stop('SIGTERM'));
  process.on('SIGINT', () => stop('SIGINT'));
  if (process.send) process.on('disconnect', () => stop('orchestrator went away'));
}

export function portFromEnv(name: string, fallback: number): number {
  const raw = process.env[name];
  if (raw === undefined || raw === '') return fallback;
  const port = Number(raw);
  if (!Number.isInteger(port) || port < 0 || port > 65535) throw new Error(`${name} must be a port number, got '${raw}'`);
  return port;
}

export function fatal(error: unknown): never {
  console.error(error instanceof Error ? error.message : String(error));
  process.exit(1);
}
