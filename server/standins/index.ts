// Local stand-ins for hosted services (mail, object storage, payments), on loopback, in one process.
// Started by `npm start` and `npm test`; ports and folders come from the environment.
import { startSmtpStandIn } from './smtp';
import { startS3StandIn } from './s3';
import { startPaymentsStandIn } from './payments';

export interface StandIn {
  name: string;
  stop(): Promise<void>;
}

type Starter = (env: NodeJS.ProcessEnv) => Promise<StandIn>;

/** Each hosted service's stand-in, started in this order. */
export const standIns: Starter[] = [startSmtpStandIn, startS3StandIn, startPaymentsStandIn];

export async function startStandIns(env: NodeJS.ProcessEnv = process.env): Promise<StandIn[]> {
  const started: StandIn[] = [];
  for (const start of standIns) started.push(await start(env));
  return started;
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const running = await startStandIns();
  console.log(`[stand-ins] up: ${running.map((s) => s.name).join(', ') || 'none yet'}`);
  const stop = async () => {
    for (const s of running.reverse()) await s.stop().catch(() => undefined);
    process.exit(0);
  };
  process.on('SIGTERM', () => void stop());
  process.on('SIGINT', () => void stop());
  setInterval(() => undefined, 1 << 30);
}
