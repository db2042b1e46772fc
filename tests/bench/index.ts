// `npm run bench`: every benchmark, printed as one JSON object. Speed goals live here, not in timed tests.
// Runs on its own instance (data folder, ports) so it can run beside `npm start` and `npm test`.
import { ensureApt } from '../../scripts/lib.mjs';

process.env.TEST_INSTANCE ??= 'bench';
process.env.TEST_DB_PORT ??= '3309';
process.env.TEST_APP_PORT ??= '3101';
process.env.AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED ??= 'true';

ensureApt('chromium', ['chromium', 'fonts-liberation']);
const { runEngineBench } = await import('./engine');
const { runBoardBench } = await import('./board');
const { runSpeedBench } = await import('./speed');

const engine = await runEngineBench();
const board = await runBoardBench();
// The athlete's phone and the API against bare baselines (tests/bench/phone.ts, tests/bench/api.ts).
const speed = await runSpeedBench();
console.log(
  JSON.stringify(
    { machine: { cpus: (await import('node:os')).cpus().length, node: process.version }, engine, board, ...speed },
    null,
    2,
  ),
);
process.exit(0);
