/** Actions that run the engine's longer jobs on the design: re-planning and the tolerance spread. */
import type { ActionContext } from './action-context';

/** The analysis actions the key table reaches, bound to one render's context. */
export interface AnalysisActions {
  /** Re-plans the string from the targets (one undo step), or says why it cannot. */
  plan(): void;
  /** Starts the spread run; progress and the result go to the state. */
  startSpread(): void;
  /** Stops the spread run in progress. */
  cancelSpread(): void;
}

/** Binds the analysis actions to `c`. */
export function analysisActions(c: ActionContext): AnalysisActions {
  const { s, dispatch, services } = c;

  const plan = () => {
    if (!services.plan) return;
    const out = services.plan(s.design);
    if (out.ok) dispatch({ type: 'replace-design', design: out.design, message: `re-planned: ${out.summary} (u undoes)` });
    else c.say(`plan: ${out.message}`, 'error');
  };

  const startSpread = () => {
    if (!services.spread) return;
    const design = s.design;
    const job = services.spread(design, (done, total) => dispatch({ type: 'spread', status: { state: 'running', done, total } }));
    c.spreadJob.current = job;
    dispatch({ type: 'spread', status: { state: 'running', done: 0, total: 1 } });
    job.result.then(
      (result) => {
        if (c.spreadJob.current !== job) return;
        c.spreadJob.current = null;
        dispatch({ type: 'spread', status: result ? { state: 'done', design, result } : { state: 'idle' } });
        c.say(result ? `spread done: ${result.trials} trials (see Findings)` : 'spread cancelled');
      },
      (e: Error) => {
        c.spreadJob.current = null;
        dispatch({ type: 'spread', status: { state: 'failed', message: e.message } });
      },
    );
  };

  const cancelSpread = () => {
    c.spreadJob.current?.cancel();
    c.spreadJob.current = null;
    dispatch({ type: 'spread', status: { state: 'idle' } });
    c.say('spread cancelled');
  };

  return { plan, startSpread, cancelSpread };
}
