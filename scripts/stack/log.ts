// One voice for the orchestrator's own lines, so they stand out from the services' output.
const useColor = process.stdout.isTTY && !process.env.NO_COLOR;

export function paint(code: number, text: string): string {
  return useColor ? `\u001b[${code}m${text}\u001b[0m` : text;
}

export function say(message: string): void {
  process.stdout.write(`${paint(36, '[stack]')} ${message}\n`);
}

export function warn(message: string): void {
  process.stderr.write(`${paint(33, '[stack]')} ${message}\n`);
}

export function fail(message: string): void {
  process.stderr.write(`${paint(31, '[stack] error:')} ${message}\n`);
}

export function seconds(ms: number): string {
  return `${(ms / 1000).toFixed(1)} s`;
}
