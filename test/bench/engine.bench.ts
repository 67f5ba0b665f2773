import { analyze } from '../../src/engine/analyze';
import { eightStepDesign } from '../helpers/designs';
import { type BenchResult, timePerCall } from './measure';

/** One full analysis of the 8-channel, two-package design: both sweeps, currents and checks. */
export async function benchEngine(): Promise<BenchResult[]> {
  const design = eightStepDesign();
  const medianMs = timePerCall(() => analyze(design), 200, 31);
  return [{ name: 'analyse 8 channels on 2 packages (full)', medianMs, limitMs: 0.2 }];
}
