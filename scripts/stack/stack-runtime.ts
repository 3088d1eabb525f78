import { describeExit, ManagedChild, type ChildSpec } from './managed-child';
import { say, warn } from './log';
import type { PostgresCluster } from './postgres-cluster';

export type StopReason =
  | { readonly kind: 'signal'; readonly signal: NodeJS.Signals }
  | { readonly kind: 'failure'; readonly message: string };

/** Thrown by step() when a stop was requested (signal or a service died) while waiting. */
export class StopRequested extends Error {
  constructor(readonly reason: StopReason) {
    super(reason.kind === 'signal' ? `stopped by ${reason.signal}` : reason.message);
  }
}

type Tier = 'app' | 'service';

const APP_GRACE_MS = Number(process.env.TW_STOP_GRACE_MS ?? 10_000);
const SERVICE_GRACE_MS = 3_000;

/**
 * Owns everything a stack starts and stops it in order: app processes (server, worker, tasks,
 * jest) first, then the fakes, then PostgreSQL. The first SIGINT/SIGTERM/SIGHUP starts a normal
 * shutdown; a second one kills what is left at once.
 */
export class StackRuntime {
  private readonly children: { child: ManagedChild; tier: Tier }[] = [];
  private readonly clusters: PostgresCluster[] = [];
  private readonly watched: PostgresCluster[] = [];
  private readonly pending: Promise<unknown>[] = [];
  private reason: StopReason | undefined;
  private resolveStop!: (reason: StopReason) => void;
  private readonly stopPromise: Promise<StopReason>;
  private shutdownPromise: Promise<void> | undefined;
  private forced = false;
  private watchdog: NodeJS.Timeout | undefined;

  constructor() {
    this.stopPromise = new Promise((resolve) => (this.resolveStop = resolve));
    for (const signal of ['SIGINT', 'SIGTERM', 'SIGHUP'] as const) {
      process.on(signal, () => this.onSignal(signal));
    }
  }

  get stopReason(): StopReason | undefined {
    return this.reason;
  }

  /** Resolves when a signal arrives or a service dies. */
  untilStop(): Promise<StopReason> {
    return this.stopPromise;
  }

  /** Awaits work unless a stop is requested first. */
  async step<T>(work: Promise<T>): Promise<T> {
    if (this.reason) throw new StopRequested(this.reason);
    const stopped = this.stopPromise.then((reason) => {
      throw new StopRequested(reason);
    });
    return Promise.race([work, stopped]);
  }

  fail(message: string): void {
    this.requestStop({ kind: 'failure', message });
  }

  /** Starts a child; its unexpected exit (while no stop was requested) fails the stack when critical. */
  spawn(spec: ChildSpec, tier: Tier, critical: boolean): ManagedChild {
    if (this.reason) throw new StopRequested(this.reason);
    const child = new ManagedChild(spec);
    this.children.push({ child, tier });
    if (critical) {
      void child.exited.then((exit) => {
        if (this.reason) return;
        const tail = child.logTail();
        this.fail(`${child.name} stopped unexpectedly (${describeExit(exit)})${tail ? `\n--- ${child.name} log (last lines) ---\n${tail}` : ''}`);
      });
    }
    return child;
  }

  /** Starts a fake that reports readiness over IPC; resolves with its ready message. */
  async startService<T extends object>(spec: Omit<ChildSpec, 'ipc'>, timeoutMs = 30_000): Promise<T> {
    const child = this.spawn({ ...spec, ipc: true }, 'service', true);
    return this.step(child.waitForReady<T>(timeoutMs));
  }

  /** Runs a one-shot child (migrations, seed) to completion; a non-zero exit is an error. */
  async runTask(spec: ChildSpec): Promise<void> {
    const child = this.spawn(spec, 'app', false);
    const exit = await this.step(child.exited);
    if (exit.code !== 0) throw new Error(`${spec.name} failed (${describeExit(exit)})`);
  }

  /** Starts (and later stops) a cluster; watches that it keeps running. */
  async startCluster(cluster: PostgresCluster): Promise<void> {
    if (this.reason) throw new StopRequested(this.reason);
    this.clusters.push(cluster);
    const starting = cluster.start();
    this.pending.push(starting.catch(() => undefined));
    await this.step(starting);
    this.watched.push(cluster);
    this.watchdog ??= setInterval(() => {
      for (const c of this.watched) {
        if (!this.reason && !c.isRunning()) {
          this.fail(`PostgreSQL on port ${c.port} stopped unexpectedly\n--- ${c.options.logFile} (last lines) ---\n${c.logTail()}`);
        }
      }
    }, 2000);
  }

  /** Remembers work that must settle before shutdown stops the databases (initdb, pg_ctl). */
  track<T>(work: Promise<T>): Promise<T> {
    this.pending.push(work.catch(() => undefined));
    return work;
  }

  shutdown(): Promise<void> {
    this.shutdownPromise ??= this.doShutdown();
    return this.shutdownPromise;
  }

  private async doShutdown(): Promise<void> {
    if (!this.reason) this.requestStop({ kind: 'signal', signal: 'SIGTERM' });
    if (this.watchdog) clearInterval(this.watchdog);
    const stopTier = (tier: Tier, graceMs: number) =>
      Promise.all(this.children.filter((c) => c.tier === tier).map(({ child }) => child.stop(this.forced ? 0 : graceMs)));
    await stopTier('app', APP_GRACE_MS);
    await stopTier('service', SERVICE_GRACE_MS);
    await Promise.all(this.pending);
    for (const cluster of this.clusters) {
      try {
        await cluster.stop(this.forced || cluster.options.throwaway ? 'immediate' : 'fast');
      } catch (error) {
        warn(`could not stop PostgreSQL on port ${cluster.port}: ${(error as Error).message}`);
      }
    }
  }

  private requestStop(reason: StopReason): void {
    if (this.reason) return;
    this.reason = reason;
    this.resolveStop(reason);
  }

  private onSignal(signal: NodeJS.Signals): void {
    if (!this.reason) {
      say(`${signal} received: stopping (again to force)`);
      this.requestStop({ kind: 'signal', signal });
      return;
    }
    if (this.forced) return;
    this.forced = true;
    warn(`${signal} again: killing everything now`);
    for (const { child } of this.children) child.kill();
  }
}

/**
 * Like Promise.all, but waits for every promise (none is left to reject unobserved) and then
 * throws the most telling error: a real failure before a mere StopRequested.
 */
export async function settleAll(work: readonly Promise<unknown>[]): Promise<void> {
  const results = await Promise.allSettled(work);
  const errors = results.flatMap((r) => (r.status === 'rejected' ? [r.reason as unknown] : []));
  if (!errors.length) return;
  throw errors.find((e) => !(e instanceof StopRequested)) ?? errors[0];
}
