/** What the local fakes' command-line entry points share: reading ports and stopping once on a signal. */

export function portFromEnv(name: string, fallback: number): number {
  const raw = process.env[name];
  if (raw === undefined || raw.trim() === '') return fallback;
  const port = Number(raw);
  if (!Number.isInteger(port) || port < 0 || port > 65535) {
    throw new Error(`${name} must be a port number from 0 to 65535, got "${raw}"`);
  }
  return port;
}

/**
 * Starts a fake and keeps it running until SIGINT or SIGTERM. Ctrl-C arrives more than once (from the
 * terminal and relayed by npm): the first signal closes the fake, the rest are ignored.
 */
export function runFake(name: string, start: () => Promise<{ close(): Promise<void> }>): void {
  start().then(
    (fake) => {
      let stopping = false;
      const stop = (signal: NodeJS.Signals): void => {
        if (stopping) return;
        stopping = true;
        fake.close().then(
          () => {
            console.log(`${name}: stopped (${signal})`);
            process.exit(0);
          },
          (err: unknown) => {
            console.error(`${name}: error while stopping`, err);
            process.exit(1);
          },
        );
      };
      process.on('SIGINT', stop);
      process.on('SIGTERM', stop);
    },
    (err: unknown) => {
      console.error(`${name}: could not start:`, err instanceof Error ? err.message : err);
      process.exit(1);
    },
  );
}
