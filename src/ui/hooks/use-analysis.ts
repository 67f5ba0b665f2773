import { useMemo } from 'react';
import type { Analysis, ProbeResult } from '../../engine/analysis-types';
import { analyze, probe } from '../../engine/analyze';
import type { Design } from '../../engine/design/types';
import { type Prepared, prepare } from '../../engine/prepare';
import type { ProbeDirection } from '../state/app-state';

/** The exact analysis of a design, or why it could not be done. */
export type Computed = { ok: true; prepared: Prepared; analysis: Analysis } | { ok: false; message: string };

/** Runs the engine on `design`; an engine failure becomes a message, never a crash of the screen. */
export function computeAnalysis(design: Design): Computed {
  try {
    const prepared = prepare(design);
    return { ok: true, prepared, analysis: analyze(design, prepared) };
  } catch (e) {
    return { ok: false, message: `the circuit cannot be solved: ${(e as Error).message}. Undo the last edit (u) or check the values.` };
  }
}

/** The analysis, recomputed only when the design object changes (a few milliseconds). */
export function useAnalysis(design: Design): Computed {
  return useMemo(() => computeAnalysis(design), [design]);
}

/** The circuit at the probe, recomputed when the analysis or the probe moves. */
export function useProbe(computed: Computed, x: number, direction: ProbeDirection): ProbeResult | null {
  return useMemo(() => {
    if (!computed.ok) return null;
    try {
      return probe(computed.prepared, x, direction);
    } catch {
      return null;
    }
  }, [computed, x, direction]);
}
