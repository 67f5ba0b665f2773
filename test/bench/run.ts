import { cpus } from 'node:os';
import { benchEngine } from './engine.bench';
import { benchPlan } from './plan.bench';
import { benchSpread } from './spread.bench';
import { benchTui } from './tui.bench';
import { type BenchResult, nodeStartMs } from './measure';

/** `npm run bench`: every figure the issues promise, against its limit, beside `node -e 0`. */
async function run(): Promise<number> {
  const start = nodeStartMs();
  process.stdout.write(`tapline benchmarks on ${cpus().length} × ${cpus()[0]?.model ?? 'unknown cpu'}, node ${process.version}\n`);
  process.stdout.write(`node -e 0: ${start.toFixed(1)} ms (median of 7)\n\n`);
  const results: BenchResult[] = [...(await benchEngine()), await benchPlan(), ...(await benchSpread()), ...(await benchTui())];
  let failed = 0;
  for (const r of results) {
    const isTime = r.medianMs !== undefined;
    const value = isTime ? r.medianMs! : r.value!;
    const limit = isTime ? r.limitMs! : r.limit!;
    const unit = isTime ? 'ms' : r.unit ?? '';
    const ok = value <= limit;
    if (!ok) failed++;
    const shown = value < 1 ? value.toFixed(3) : value.toFixed(1);
    process.stdout.write(`${ok ? 'ok  ' : 'FAIL'}  ${r.name.padEnd(52)} ${shown.padStart(9)} ${unit.padEnd(3)} (limit ${limit} ${unit})\n`);
  }
  process.stdout.write(`\n${results.length - failed} within limits, ${failed} over\n`);
  return failed ? 1 : 0;
}

run().then((code) => (process.exitCode = code));
