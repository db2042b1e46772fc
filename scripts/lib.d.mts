// Types for the dependency-free lifecycle helpers, so TypeScript tests can use them.
import type { ChildProcess, SpawnOptions } from 'node:child_process';

export const ROOT: string;
export const BIN: string;
export function log(message: string): void;
export function fail(message: string): never;
export function ensureNodeModules(): void;
export function ensureApt(binary: string, packages: string[]): string;
export interface MariaDbInstance {
  dir: string;
  socket: string;
  port: number;
  secrets: { dbPassword: string; sessionSecret: string };
  startedHere: boolean;
  urlFor(db: string): string;
  stop(): Promise<void>;
}
export function startMariaDb(opts: {
  name: string;
  port: number;
  databases: string[];
  user?: string;
  /** Further mariadbd options, e.g. for replication. */
  serverArgs?: string[];
}): Promise<MariaDbInstance>;
export function startChild(
  cmd: string,
  args: string[],
  opts?: SpawnOptions,
): ChildProcess & { stopGroup(signal?: NodeJS.Signals, graceMs?: number): Promise<void> };
export function waitForHttp(url: string, opts?: { timeoutMs?: number; child?: ChildProcess }): Promise<void>;
export function standinPorts(base: number): { smtp: number; mailApi: number; s3: number; payments: number };
export function standinEnv(ports: ReturnType<typeof standinPorts>, dir: string): Record<string, string>;
