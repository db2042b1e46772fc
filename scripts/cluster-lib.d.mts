// Types for the cluster helpers, so TypeScript tests and benches can use them.
import type { ChildProcess } from 'node:child_process';
import type { MariaDbInstance } from './lib.mjs';

export interface ClusterApp {
  label: string;
  url: string;
  logFile: string;
  child: ChildProcess;
  stop(): Promise<void>;
}

export interface Cluster {
  primary: MariaDbInstance;
  replica: MariaDbInstance;
  primaryUrl: string;
  replicaUrl: string;
  apps: ClusterApp[];
  balancerUrl: string;
  logDir: string;
  serviceEnv: NodeJS.ProcessEnv;
  stopReplica(): Promise<void>;
  startReplica(): Promise<void>;
  stop(): Promise<void>;
}

export function startCluster(opts?: {
  name?: string;
  dbPort?: number;
  appPorts?: number[];
  balancerPort?: number;
  standins?: 'own' | 'inherit';
  standinBase?: number;
  client?: boolean;
  rebuild?: boolean;
  fresh?: boolean;
  replica?: boolean;
  seedDemo?: boolean;
  appEnv?: Record<string, string>;
}): Promise<Cluster>;

export function rootSql(instance: Pick<MariaDbInstance, 'socket' | 'port'>, sql: string): string[][];
export function replicationStatus(replica: Pick<MariaDbInstance, 'socket'>): {
  configured: boolean;
  io: boolean;
  sql: boolean;
  lastError: string;
  gtid: string;
};
export function waitForReplica(primary: MariaDbInstance, replica: MariaDbInstance, timeoutMs?: number): Promise<void>;
