/**
 * A SPICE netlist of a design, made of plain portable elements: resistors, independent and linear
 * controlled sources, voltage-controlled switches and diodes. It ramps the measured quantity slowly
 * up and back down and measures where each output changes, so any SPICE with `.meas` can confirm
 * the engine's trip points. Element values come from the same network the engine solves.
 */
import type { Design } from '../design/types';
import { GND, type NetDiode } from '../network/types';
import { type Prepared, prepare } from '../prepare';
import { assignDesignators, type Designators } from './designators';
import { RAMP_SECONDS, spiceMeasures, tripTolerance } from './spice-measures';

/** Switch hysteresis half-width (V): tiny, so the switch trips within microvolts of the comparator. */
const SWITCH_VH = 1e-6;
/** Switch off resistance (ohms). */
const SWITCH_ROFF = 1e12;

/** A number as SPICE reads it: plain decimal or exponent, 10 significant digits. */
export function spiceNumber(v: number): string {
  return String(Number(v.toPrecision(10)));
}

/** Node names for SPICE: lower case letters, digits and underscores, unique, never "0" or "gnd". */
function nodeNames(nodes: string[]): (k: number) => string {
  const used = new Set(['0', 'gnd', 'x', 'vq']);
  const names = nodes.map((n) => {
    let base = n.toLowerCase().replace(/\+/g, 'p').replace(/-/g, 'm').replace(/[^a-z0-9_]/g, '_');
    if (!/^[a-z]/.test(base)) base = `n${base}`;
    let name = base;
    for (let i = 2; used.has(name); i++) name = `${base}_${i}`;
    used.add(name);
    return name;
  });
  return (k) => (k === GND ? '0' : names[k]);
}

/**
 * The netlist text for `design` (ngspice batch mode: `ngspice -b FILE`). Uses `prepared` when
 * given (so a perturbed network can be exported) and the shared designator map.
 */
export function spiceNetlist(design: Design, prepared: Prepared = prepare(design), ds: Designators = assignDesignators(design)): string {
  const { net } = prepared;
  const node = nodeNames(net.nodes);
  const n = spiceNumber;
  const q = design.quantity;
  const tol = tripTolerance(prepared);
  const span = Math.max(q.max - q.min, 1e-9);
  const tmax = (RAMP_SECONDS * tol) / 10 / span;
  const lines: string[] = [
    `* ${design.name}: comparator thresholds, exported by tapline`,
    `* Stimulus: node x carries the measured quantity (${q.name}) as 1 V per ${q.unit || 'unit'};`,
    `* it ramps ${n(q.min)} -> ${n(q.max)} in ${RAMP_SECONDS} s and back. Run: ngspice -b FILE`,
    `* Each comparator: offset as a source on its + input, bias currents as sources, an open-collector`,
    `* output as a switch in series with its saturation source; LEDs as near-ideal diode + knee source + resistance.`,
    '',
    `VX x 0 PWL(0 ${n(q.min)} ${RAMP_SECONDS} ${n(q.max)} ${2 * RAMP_SECONDS} ${n(q.min)})`,
  ];
  const affine = (name: string, at: string, c0: number, c1: number) => {
    if (c1 === 0) return lines.push(`V${name} ${at} 0 DC ${n(c0)}`);
    if (c0 === 0) return lines.push(`E${name} ${at} 0 x 0 ${n(c1)}`);
    lines.push(`E${name} ${at}_e 0 x 0 ${n(c1)}`, `V${name} ${at} ${at}_e DC ${n(c0)}`);
  };
  lines.push('', '* Sources: V = c0 + c1*x');
  for (const s of net.vsources) affine(s.id.replace(/^V:?/, '').replace(/[^A-Za-z0-9_]/g, '_') || 'SRC', node(s.node), s.c0, s.c1);
  for (const s of net.isources) {
    const id = s.id.replace(/[^A-Za-z0-9_]/g, '_');
    lines.push(`I${id} ${node(s.from)} ${node(s.to)} DC ${n(s.c0)}`);
    if (s.c1 !== 0) lines.push(`G${id} ${node(s.from)} ${node(s.to)} x 0 ${n(s.c1)}`);
  }
  if (net.quiescent > 0) lines.push(`IQ ${node(net.supply)} 0 DC ${n(net.quiescent)} $ package quiescent current`);

  lines.push('', '* Resistors');
  for (const r of net.resistors) lines.push(`${ds.of(r.id)} ${node(r.a)} ${node(r.b)} ${n(r.ohms)} $ ${r.id}`);

  lines.push('', '* Diodes: near-ideal junction + knee source + series resistance');
  for (const d of net.diodes) lines.push(...diodeLines(d, ds, node));

  const models = [`.model SWQ SW(VT=0 VH=${SWITCH_VH} RON=1 ROFF=${SWITCH_ROFF})`, '.model DIDEAL D(IS=1e-14 N=1e-5)'];
  lines.push('', '* Comparators: the switch closes when V(-) > V(+) + Vos');
  const initial = prepared.sweep.initial;
  net.comparators.forEach((c, k) => {
    const u = ds.unitOf(c.id);
    const lu = u.toLowerCase();
    const ron = Math.min(1e-3, c.rsat / 2);
    const start = initial[k] ? 'ON' : 'OFF';
    models.push(`.model SW_${u} SW(VT=0 VH=${SWITCH_VH} RON=${n(ron)} ROFF=${SWITCH_ROFF})`);
    const plus = node(c.plus);
    const minus = node(c.minus);
    lines.push(`* ${u}: channel ${c.id}`, `VOS_${u} ${lu}_vos ${plus} DC ${n(c.vos)}`);
    if (c.ibPlus !== 0) lines.push(`IBP_${u} 0 ${plus} DC ${n(c.ibPlus)}`);
    if (c.ibMinus !== 0) lines.push(`IBM_${u} 0 ${minus} DC ${n(c.ibMinus)}`);
    const satEnd = c.vsat0 === 0 ? '0' : `${lu}_sat`;
    lines.push(`S${u} ${node(c.out)} ${lu}_s ${minus} ${lu}_vos SW_${u} ${start}`, `RSAT_${u} ${lu}_s ${satEnd} ${n(c.rsat - ron)}`);
    if (c.vsat0 !== 0) lines.push(`VSAT_${u} ${lu}_sat 0 DC ${n(c.vsat0)}`);
    if (c.pushPull) {
      lines.push(
        `SH${u} ${node(c.out)} ${lu}_h ${lu}_vos ${minus} SW_${u} ${start === 'ON' ? 'OFF' : 'ON'}`,
        `ROUT_${u} ${lu}_h ${lu}_oh ${n(Math.max(c.rout - ron, ron))}`,
        `VOH_${u} ${node(net.supply)} ${lu}_oh DC ${n(c.vohDrop)}`,
      );
    }
    lines.push(`SQ${u} q_${lu} 0 ${minus} ${lu}_vos SWQ ${start}`, `RQ_${u} vq q_${lu} 1k $ indicator: v(q_${lu}) is 1 V high, 0 V sinking`);
  });
  if (net.comparators.length) lines.push('VQ vq 0 DC 1');

  const measures = spiceMeasures(prepared, ds);
  lines.push('', ...models, '', '.options reltol=1e-6 vntol=1e-7 abstol=1e-12 itl4=100');
  lines.push(`.save v(x) ${net.comparators.map((c) => `v(q_${ds.unitOf(c.id).toLowerCase()})`).join(' ')}`);
  lines.push(`.tran ${n(tmax)} ${2 * RAMP_SECONDS} 0 ${n(tmax)}`, '');
  lines.push(`* Trip points: x where each indicator crosses 0.5 V (engine value in the comment, unit ${q.unit || 'of x'})`);
  for (const m of measures) {
    const dir = m.to === 'low' ? 'FALL' : 'RISE';
    const td = m.edge === 'falling' ? ` TD=${RAMP_SECONDS}` : '';
    lines.push(`.meas tran ${m.name} FIND v(x) WHEN v(q_${m.unit.toLowerCase()})=0.5${td} ${dir}=1 $ ${m.edge}, engine ${n(m.x)}`);
  }
  lines.push('.end', '');
  // Inline comments are not portable across simulators: each becomes a comment line above its card.
  return lines.flatMap((l) => (l.includes(' $ ') ? [`* ${l.slice(l.indexOf(' $ ') + 3)}`, l.slice(0, l.indexOf(' $ '))] : [l])).join('\n');
}

function diodeLines(d: NetDiode, ds: Designators, node: (k: number) => string): string[] {
  const ref = d.kind === 'shunt' ? ds.of('VREF') : ds.of(d.id);
  const lr = ref.toLowerCase();
  const out: string[] = [];
  let anode = node(d.anode);
  if (d.seriesId && d.rSeries > 0) {
    out.push(`${ds.of(d.seriesId)} ${anode} ${lr}_r ${spiceNumber(d.rSeries)} $ ${d.seriesId}`);
    anode = `${lr}_r`;
  }
  const what = d.kind === 'shunt' ? 'shunt reference' : `LED of channel ${d.channel}`;
  out.push(
    `D_${ref} ${anode} ${lr}_j DIDEAL $ ${what}`,
    `VK_${ref} ${lr}_j ${lr}_k DC ${spiceNumber(d.knee)}`,
    `RDYN_${ref} ${lr}_k ${node(d.cathode)} ${spiceNumber(Math.max(d.rdyn, 1e-6))}`,
  );
  return out;
}
