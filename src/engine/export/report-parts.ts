/**
 * Pieces of the Markdown report that describe the design itself: the job statement in words and
 * the resistor string drawn as text.
 */
import type { Analysis } from '../analysis-types';
import type { Design, TargetFunction } from '../design/types';
import { formatEng } from '../values';
import type { Designators } from './designators';

/** x as text in the design's unit, 4 significant figures. */
export function formatX(design: Design, x: number | null): string {
  if (x === null || !Number.isFinite(x)) return '-';
  const unit = design.quantity.unit;
  if (['V', 'A', 'W', 'F'].includes(unit)) return formatEng(x, unit, { digits: 4 });
  return `${Number(x.toPrecision(4))} ${unit}`.trim();
}

function list(items: string[]): string {
  return items.length < 2 ? items.join('') : `${items.slice(0, -1).join(', ')} and ${items[items.length - 1]}`;
}

function describe(design: Design, fn: TargetFunction): string {
  const fx = (x: number) => formatX(design, x);
  const hyst = `${fx(fn.hysteresis)} hysteresis (${fn.anchor === 'centre' ? 'centred on the stated value' : `${fn.anchor} edge on the stated value`})`;
  const load = (l: 'led' | 'logic' | 'relay') => (l === 'led' ? 'an LED' : l === 'logic' ? 'a logic input' : 'a relay driver');
  if (fn.kind === 'bar') {
    const how = fn.mode === 'dot' ? 'a dot display: only the step at the level lit' : 'a bar display: every step below the level lit';
    return `${fn.id}: ${how}, ${fn.thresholds.length} steps at ${list(fn.thresholds.map(fx))}, ${hyst}`;
  }
  if (fn.kind === 'window') {
    return `${fn.id}: a window from ${fx(fn.low)} to ${fx(fn.high)}, output asserted ${fn.sense} it, driving ${load(fn.load)}, ${hyst}`;
  }
  return `${fn.id}: an output asserted when x is ${fn.polarity} ${fx(fn.threshold)}, driving ${load(fn.load)}, ${hyst}`;
}

/** The job statement: what is measured, how it reaches the comparators, and what each target asks. */
export function jobStatement(design: Design): string {
  const q = design.quantity;
  const input = design.input;
  const sensor =
    input.signal === 'current'
      ? `a current loop of ${formatEng(input.offset, 'A')} + ${formatEng(input.gain, 'A')} per ${q.unit} into a ${formatEng(input.shunt ?? 250, 'Ω')} shunt`
      : input.offset === 0 && input.gain === 1
        ? 'the voltage itself'
        : `a sensor giving ${formatEng(input.offset, 'V')} + ${formatEng(input.gain, 'V')} per ${q.unit}`;
  const supply = design.supply.kind === 'measured' ? 'the circuit runs from the voltage it measures' : `the circuit runs from a fixed ${formatEng(design.supply.volts, 'V')} rail (${formatEng(design.supply.min, 'V')} to ${formatEng(design.supply.max, 'V')})`;
  const lines = [`Watch ${q.name} from ${formatX(design, q.min)} to ${formatX(design, q.max)}, read through ${sensor}; ${supply}.`];
  const t = design.targets;
  if (!t) return `${lines[0]}\n\nNo targets are stated: this report describes the circuit as built.`;
  lines.push('', ...t.functions.map((f) => `- ${describe(design, f)}.`), '');
  lines.push(
    `Resistors ${t.series}, ${Number((t.tolerance * 100).toPrecision(3))} %; string within ${formatEng(t.stringBudget, 'A')}; at most ${t.maxPackages} quad package${t.maxPackages === 1 ? '' : 's'}; trip points within ${formatX(design, t.allowance)} of target.`,
  );
  return lines.join('\n');
}

/** The string drawn top to bottom as text: feed, each resistor, each tap with its voltage range and the inputs on it. */
export function drawString(design: Design, a: Analysis, ds: Designators): string {
  const unitPin = (node: string) =>
    design.channels.flatMap((c) => {
      const pins = [c.plus === node ? '+' : '', c.minus === node ? '−' : ''].filter(Boolean);
      return pins.map((p) => `${ds.unitOf(c.id)} ${p} (${c.label})`);
    });
  const ref = design.reference;
  const top =
    ref.kind === 'supply'
      ? 'supply rail (thresholds follow the supply)'
      : ref.kind === 'external'
        ? `external reference ${formatEng(ref.volts, 'V', { digits: 4 })}`
        : `${ds.of('VREF')} shunt reference ${formatEng(ref.volts, 'V', { digits: 4 })}, fed from the supply by ${ds.of('RB')} ${formatEng(ref.bias, 'Ω')}`;
  const out = ['```', `ref: ${top}`];
  const onRef = unitPin('ref');
  if (onRef.length) out.push(`  +-- ${onRef.join(', ')}`);
  design.string.forEach((ohms, k) => {
    out.push('  |', `  ${ds.of(`RS${k + 1}`).padEnd(4)} ${formatEng(ohms, 'Ω')}`, '  |');
    if (k === design.string.length - 1) return;
    const node = `T${k + 1}`;
    const tap = a.taps.find((t) => t.node === node);
    const volts = tap ? `${formatEng(tap.min, 'V', { digits: 4 })}${Math.abs(tap.max - tap.min) > 5e-5 ? ` .. ${formatEng(tap.max, 'V', { digits: 4 })}` : ''}` : '';
    const users = unitPin(node);
    out.push(`  +-- ${node}  ${volts}${users.length ? `  -> ${users.join(', ')}` : ''}`);
  });
  out.push('  GND', '```');
  return out.join('\n');
}
