// The speed benchmarks on one stack: the athlete's phone, then the API against its bare baselines.
// Run alone with `npx tsx tests/bench/speed.ts` (uses the TEST_* instance variables); `npm run bench` runs it too.
import { pathToFileURL } from 'node:url';
import { runApiBench } from './api';
import { runPhoneBench } from './phone';
import { startSpeedStack } from './speed-stack';

/** BENCH_SPEED_PARTS=phone (or api) runs one part only, for a quicker look while working. */
export async function runSpeedBench() {
  const parts = (process.env.BENCH_SPEED_PARTS ?? 'phone,api').split(',');
  const stack = await startSpeedStack();
  try {
    const phone = parts.includes('phone') ? await runPhoneBench(stack) : null;
    const api = parts.includes('api') ? await runApiBench(stack) : null;
    return { phone, api };
  } finally {
    await stack.stop();
  }
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  process.env.AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED ??= 'true';
  const { cpus } = await import('node:os');
  const result = await runSpeedBench();
  console.log(JSON.stringify({ machine: { cpus: cpus().length, node: process.version }, ...result }, null, 2));
  process.exit(0);
}
