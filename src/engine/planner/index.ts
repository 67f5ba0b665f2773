/**
 * The planner: targets in, a realised design out (ENGINE.md §3). Pure.
 *
 * allocate → scale the input and pick the reference → synthesize → close against the exact sweep
 * → standard values → final exact analysis and the target-vs-realised report.
 */
import { analyze } from '../analyze';
import type { Design } from '../design/types';
import { allocate, expandFunctions, targetProblems } from './allocate';
import { close } from './close';
import { standardise } from './finish';
import { allocationMap, tripRows, valueList } from './report';
import { planBias, planInput, referenceVolts } from './scaling';
import { synthesize, tapResistance } from './synthesize';
import type { PlanProblem, PlanResult } from './types';

export type { MapEntry, PairOffer, PlanProblem, PlanResult, PlanRow, ValueEntry } from './types';

/**
 * Plans `design.targets` into a realised design: channels placed on quad packages, every resistor
 * sized, closed against the exact sweep and snapped to the target series. `ok` is false when a
 * target cannot be met; `problems` says which and why. The input design is not modified.
 */
export function plan(input: Design): PlanResult {
  const design = structuredClone(input);
  const fail = (problems: PlanProblem[], notes: string[] = []): PlanResult => ({
    ok: false, design: input, allocation: [], rows: [], values: [], pairs: [], notes, problems,
  });
  const t = design.targets;
  if (!t || t.functions.length === 0) {
    return fail([{ target: 'design', message: 'the design has no targets to plan.', fix: 'Add targets.functions (bar, window or single).' }]);
  }
  const unitName = design.quantity.unit;
  const units = expandFunctions(t.functions, unitName);
  const problems = targetProblems(units, unitName);
  const placed = allocate(units, t.maxPackages);
  if (placed.problem) problems.push(placed.problem);
  if (problems.length) return fail(problems);
  design.spares = placed.spares;
  const vref = referenceVolts(design);
  if (typeof vref !== 'number') return fail([vref]);
  const xTop = Math.max(...units.map((u) => u.rising));
  const xBottom = Math.min(...units.map((u) => u.falling));
  const sense = planInput(design, t, vref, xTop, xBottom);
  if ('target' in sense) return fail([sense]);
  const model = synthesize(design, t, units, vref, sense);
  if (Array.isArray(model)) return fail(model);
  const budget = budgetProblems(design, t.allowance, sense.a1, sense.rth, units.filter((u) => u.sinksOnRise).length);
  if (budget.length) return fail(budget, model.notes);
  planBias(design, (2 * vref) / model.total);
  const closed = close(model);
  if (closed.stuck.length) {
    return fail([{ target: closed.stuck.join(', '), message: `closure could not make ${closed.stuck.join(', ')} switch inside the x range.`, fix: 'Check the quantity range covers every threshold with its hysteresis.' }], model.notes);
  }
  const std = standardise(model);
  if (std.problem) return fail([std.problem], model.notes);
  const load = vref / design.string.reduce((a, b) => a + b, 0) + design.channels.reduce((s, c) => s + (c.feedback && c.plus.startsWith('T') && !c.seriesPlus ? vref / c.feedback.ohms : 0), 0);
  const bias = planBias(design, load);
  if (bias) problems.push(bias);
  const analysis = analyze(design);
  const rows = tripRows(units, analysis, t.allowance);
  for (const r of rows.filter((row) => !row.ok)) {
    problems.push({
      target: r.channel,
      message: r.realised === null
        ? `${r.edge} trip of ${r.channel} never happens inside the x range.`
        : `${r.edge} trip of ${r.channel} lands at ${fmt(r.realised)} ${unitName}, ${fmt(Math.abs(r.error as number))} ${unitName} from the ${fmt(r.target)} ${unitName} target, more than the allowance (${fmt(t.allowance)} ${unitName}) even with two-resistor pairs.`,
      fix: 'Use a finer series (targets.series), raise targets.allowance, or change the string budget.',
    });
  }
  for (const f of analysis.findings.filter((x) => x.severity === 'error')) problems.push({ target: f.part, message: f.message, fix: f.fix });
  for (const u of units) if (u.feedback !== 'none') model.notes.push(`${u.id}: feedback ${u.feedback === 'tap' ? 'into its tap' : 'input-side through a series resistor'}: ${u.feedbackWhy}.`);
  return {
    ok: problems.length === 0,
    design,
    allocation: allocationMap(design, units),
    rows,
    values: valueList(design),
    pairs: std.pairs,
    notes: model.notes,
    problems,
  };
}

const fmt = (x: number) => String(Number(x.toPrecision(4)));

/**
 * Budget limits: a current budget too small leaves taps and the sense node so resistive that a
 * typical part's input bias current moves trips by more than the allowance (unit of x).
 */
function budgetProblems(design: Design, allowance: number, a1: number, rin: number, onIn: number): PlanProblem[] {
  const ib = design.part.ibTyp;
  const out: PlanProblem[] = [];
  const tapR = Math.max(...design.string.slice(1).map((_, j) => tapResistance(design.string, j + 1)));
  const shiftTap = (ib * tapR) / a1;
  if (shiftTap > allowance) {
    out.push({
      target: 'design',
      message: `string budget: the taps' source resistance (up to ${fmt(tapR)} Ω) turns the part's ${fmt(ib * 1e9)} nA input bias current into trip shifts of ${fmt(shiftTap)} ${design.quantity.unit}, more than the allowance.`,
      fix: `Raise targets.stringBudget to at least ${fmt((design.targets!.stringBudget * shiftTap) / allowance)} A.`,
    });
  }
  const shiftIn = (ib * onIn * rin) / a1;
  if (shiftIn > allowance) {
    out.push({
      target: 'design',
      message: `input budget: the divider's source resistance (${fmt(rin)} Ω) with ${onIn} inputs on it turns the input bias current into trip shifts of ${fmt(shiftIn)} ${design.quantity.unit}, more than the allowance.`,
      fix: `Raise targets.inputBudget to at least ${fmt((design.targets!.inputBudget * shiftIn) / allowance)} A.`,
    });
  }
  return out;
}
