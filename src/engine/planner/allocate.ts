/**
 * From target functions to comparator channels, and channels onto quad packages: fewest packages,
 * a window's two channels in one package, unused channels listed as spares.
 */
import type { Anchor, Spare, TargetFunction } from '../design/types';
import type { PlanProblem, Unit } from './types';

/** Channels in one quad package. */
export const QUAD = 4;

/** Rising and falling trip (unit of x) for a threshold, hysteresis and anchor. */
export function tripsFor(threshold: number, hysteresis: number, anchor: Anchor): { rising: number; falling: number } {
  if (anchor === 'rising') return { rising: threshold, falling: threshold - hysteresis };
  if (anchor === 'falling') return { rising: threshold + hysteresis, falling: threshold };
  return { rising: threshold + hysteresis / 2, falling: threshold - hysteresis / 2 };
}

function unit(fn: TargetFunction, id: string, label: string, role: Unit['role'], t: number, sinksOnRise: boolean): Unit {
  const { rising, falling } = tripsFor(t, fn.hysteresis, fn.anchor);
  return { id, label, fn, role, rising, falling, sinksOnRise, tap: '', feedback: 'none', feedbackWhy: '', package: 0, channel: 0 };
}

/**
 * The channels each function needs. A bar step sinks as x rises past it; a window's low channel
 * sinks below `low` and its high channel above `high` (wired together), except an LED lit inside,
 * which hangs between the two outputs and needs both channels to sink as x rises.
 */
export function expandFunctions(functions: TargetFunction[], unit_: string): Unit[] {
  const out: Unit[] = [];
  const show = (x: number) => `${Number(x.toPrecision(4))} ${unit_}`;
  for (const fn of functions) {
    if (fn.kind === 'bar') {
      [...fn.thresholds].sort((a, b) => a - b).forEach((t, k) => out.push(unit(fn, `${fn.id}-${k + 1}`, `${show(t)} step`, 'step', t, true)));
    } else if (fn.kind === 'window') {
      const between = fn.sense === 'inside' && fn.load === 'led';
      out.push(unit(fn, `${fn.id}-lo`, `window low ${show(fn.low)}`, 'low', fn.low, between));
      out.push(unit(fn, `${fn.id}-hi`, `window high ${show(fn.high)}`, 'high', fn.high, true));
    } else {
      out.push(unit(fn, fn.id, `${fn.polarity} ${show(fn.threshold)}`, 'single', fn.threshold, fn.polarity === 'above'));
    }
  }
  return out;
}

/** Targets that cannot be realised whatever the values: steps closer than their hysteresis, inverted windows. */
export function targetProblems(units: Unit[], unit_: string): PlanProblem[] {
  const problems: PlanProblem[] = [];
  const show = (x: number) => `${Number(x.toPrecision(4))} ${unit_}`;
  for (const fn of new Set(units.map((u) => u.fn))) {
    if (fn.hysteresis < 0) {
      problems.push({ target: fn.id, message: `hysteresis ${show(fn.hysteresis)} is negative.`, fix: 'Give a hysteresis of 0 or more.' });
    }
    const mine = units.filter((u) => u.fn === fn);
    if (fn.kind === 'bar') {
      for (let k = 1; k < mine.length; k++) {
        const lower = mine[k - 1];
        const upper = mine[k];
        if (upper.falling <= lower.rising) {
          problems.push({
            target: fn.id,
            message: `steps ${show(lower.rising)} and ${show(upper.rising)} (rising) are ${show(upper.rising - lower.rising)} apart, not more than the hysteresis (${show(fn.hysteresis)}): the upper step would release below the lower one's trip.`,
            fix: 'Spread the thresholds apart or narrow the hysteresis.',
          });
        }
      }
    }
    if (fn.kind === 'window' && mine[1].falling <= mine[0].rising) {
      problems.push({
        target: fn.id,
        message: `window ${show(fn.low)} to ${show(fn.high)} is narrower than its hysteresis (${show(fn.hysteresis)}): the two edges' bands overlap.`,
        fix: 'Widen the window or narrow the hysteresis.',
      });
    }
  }
  return problems;
}

/**
 * Places units on quad packages in place (sets `package` and `channel`): window pairs first on
 * aligned halves (channels 1–2 or 3–4), then the other channels in order. This uses
 * ceil(channels / 4) packages, the fewest possible. Returns the spares, or a problem when more
 * than `maxPackages` packages are needed.
 */
export function allocate(units: Unit[], maxPackages: number): { spares: Spare[]; packages: number; problem: PlanProblem | null } {
  const packages = Math.ceil(units.length / QUAD);
  if (packages > maxPackages) {
    return {
      spares: [],
      packages,
      problem: {
        target: 'design',
        message: `${units.length} channels need ${packages} quad packages, more than the ${maxPackages} allowed (targets.maxPackages).`,
        fix: `Allow ${packages} packages, or drop or merge functions.`,
      },
    };
  }
  const slots: (Unit | null)[] = new Array(packages * QUAD).fill(null);
  const pairs = units.filter((u) => u.role === 'low');
  let half = 0;
  for (const low of pairs) {
    const high = units.find((u) => u.fn === low.fn && u.role === 'high') as Unit;
    slots[half * 2] = low;
    slots[half * 2 + 1] = high;
    half += 1;
  }
  let free = 0;
  for (const u of units) {
    if (u.role === 'low' || u.role === 'high') continue;
    while (slots[free]) free += 1;
    slots[free] = u;
  }
  const spares: Spare[] = [];
  slots.forEach((u, k) => {
    const pkg = Math.floor(k / QUAD) + 1;
    const ch = (k % QUAD) + 1;
    if (u) {
      u.package = pkg;
      u.channel = ch;
    } else {
      spares.push({ package: pkg, channel: ch, plus: 'gnd', minus: 'ref' });
    }
  });
  return { spares, packages, problem: null };
}
