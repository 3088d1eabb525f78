import { createServer } from 'node:net';

/** Asks the kernel for `count` distinct free ports on host (all held open at once, then released). */
export async function freePorts(count: number, host = '127.0.0.1'): Promise<number[]> {
  const servers = await Promise.all(
    Array.from({ length: count }, () => new Promise<ReturnType<typeof createServer>>((resolve, reject) => {
      const server = createServer();
      server.once('error', reject);
      server.listen(0, host, () => resolve(server));
    })),
  );
  const ports = servers.map((server) => {
    const address = server.address();
    if (!address || typeof address === 'string') throw new Error('could not read a free port');
    return address.port;
  });
  await Promise.all(servers.map((server) => new Promise((resolve) => server.close(resolve))));
  return ports;
}

export function isPortFree(port: number, host = '127.0.0.1'): Promise<boolean> {
  return new Promise((resolve) => {
    const server = createServer();
    server.once('error', () => resolve(false));
    server.listen({ port, host, exclusive: true }, () => server.close(() => resolve(true)));
  });
}

/** Fails with one message naming every busy port and the variable that moves it. */
export async function assertPortsFree(ports: readonly { port: number; what: string; variable: string }[], host = '127.0.0.1'): Promise<void> {
  const busy: string[] = [];
  for (const entry of ports) {
    if (!(await isPortFree(entry.port, host))) busy.push(`  ${host}:${entry.port} (${entry.what}; choose another with ${entry.variable}=…)`);
  }
  if (busy.length) throw new Error(`these ports are already in use by another program:\n${busy.join('\n')}`);
}
