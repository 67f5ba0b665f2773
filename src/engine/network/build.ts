import type { Channel, Design } from '../design/types';
import { GND, type Network } from './types';

/** Options for building the network of a design. */
export interface BuildOptions {
  /** Use this fixed supply voltage instead of the design's nominal one (V); ignored for a measured supply. */
  supplyVolts?: number;
}

/**
 * Compiles a design into its network: names every node, folds LED series resistors into the LED
 * branch and applies nominal part values (offset 0, bias current typical in its direction).
 * Pure; never throws on a design that passed validation.
 */
export function buildNetwork(design: Design, options: BuildOptions = {}): Network {
  const nodes: string[] = [];
  const index = new Map<string, number>([['gnd', GND]]);
  const add = (name: string): number => {
    const existing = index.get(name);
    if (existing !== undefined) return existing;
    nodes.push(name);
    index.set(name, nodes.length - 1);
    return nodes.length - 1;
  };
  const alias = (name: string, node: number) => index.set(name, node);
  const net: Network = {
    nodes,
    resistors: [],
    vsources: [],
    isources: [],
    comparators: [],
    diodes: [],
    supply: 0,
    supplySource: 0,
    quiescent: 0,
  };
  const res = (id: string, a: number, b: number, ohms: number) => net.resistors.push({ id, a, b, ohms });

  // Supply rail.
  const supply = add('supply');
  net.supply = supply;
  net.supplySource = net.vsources.length;
  if (design.supply.kind === 'measured') {
    net.vsources.push({ id: 'VSUP', node: supply, c0: 0, c1: 1 });
  } else {
    net.vsources.push({ id: 'VSUP', node: supply, c0: options.supplyVolts ?? design.supply.volts, c1: 0 });
  }
  for (const rail of design.rails) net.vsources.push({ id: `V:${rail.id}`, node: add(rail.id), c0: rail.volts, c1: 0 });

  // Reference.
  const ref = design.reference;
  if (ref.kind === 'supply') alias('ref', supply);
  else if (ref.kind === 'external') net.vsources.push({ id: 'VREF', node: add('ref'), c0: ref.volts, c1: 0 });
  else {
    const node = add('ref');
    res('RB', supply, node, ref.bias);
    net.diodes.push({ id: 'VREF', kind: 'shunt', anode: node, cathode: GND, knee: ref.volts, rSeries: 0, rdyn: ref.rdyn });
  }

  buildInput(design, net, add, alias, res);

  // The string, top to bottom.
  const feed = index.get('ref') as number;
  let upper = feed;
  design.string.forEach((ohms, k) => {
    const lower = k === design.string.length - 1 ? GND : add(`T${k + 1}`);
    res(`RS${k + 1}`, upper, lower, ohms);
    upper = lower;
  });

  // Outputs first, so wired-OR partners share one node and loads can name any output.
  for (const ch of design.channels) {
    const partner = ch.wiredTo ? index.get(`out:${ch.wiredTo}`) : undefined;
    if (partner !== undefined) alias(`out:${ch.id}`, partner);
    else add(`out:${ch.id}`);
  }
  const packages = new Set(design.channels.map((c) => c.package));
  net.quiescent = packages.size * design.part.iqPerPackage;
  for (const ch of design.channels) buildChannel(design, ch, net, index, add, res);
  return net;
}

type AddNode = (name: string) => number;

function buildInput(
  design: Design,
  net: Network,
  add: AddNode,
  alias: (name: string, node: number) => void,
  res: (id: string, a: number, b: number, ohms: number) => void,
): void {
  const input = design.input;
  if (input.signal === 'current') {
    const node = add('in');
    net.isources.push({ id: 'ISIG', from: GND, to: node, c0: input.offset, c1: input.gain });
    res('RSH', node, GND, input.shunt ?? 250);
    return;
  }
  const sameAsSupply = design.supply.kind === 'measured' && input.offset === 0 && input.gain === 1;
  const sig = sameAsSupply ? net.supply : add('sig');
  if (!sameAsSupply) net.vsources.push({ id: 'VSIG', node: sig, c0: input.offset, c1: input.gain });
  if (input.divider) {
    const node = add('in');
    res('RD1', sig, node, input.divider.top);
    res('RD2', node, GND, input.divider.bottom);
  } else {
    alias('in', sig);
  }
}

function buildChannel(
  design: Design,
  ch: Channel,
  net: Network,
  index: Map<string, number>,
  add: AddNode,
  res: (id: string, a: number, b: number, ohms: number) => void,
): void {
  const node = (name: string) => index.get(name) ?? add(name);
  const out = node(`out:${ch.id}`);
  const pin = (named: string, series: number | undefined, sign: '+' | '-', id: string): number => {
    if (series === undefined) return node(named);
    const p = add(`p${sign}:${ch.id}`);
    res(id, node(named), p, series);
    return p;
  };
  const plus = pin(ch.plus, ch.seriesPlus, '+', `RIP:${ch.id}`);
  const minus = pin(ch.minus, ch.seriesMinus, '-', `RIM:${ch.id}`);
  const part = design.part;
  const ib = part.biasDirection === 'out' ? part.ibTyp : -part.ibTyp;
  net.comparators.push({
    id: ch.id,
    plus,
    minus,
    out,
    vos: 0,
    ibPlus: ib,
    ibMinus: ib,
    vsat0: part.vsat0,
    rsat: part.rsat,
    pushPull: part.output === 'push-pull',
    vohDrop: part.vohDrop,
    rout: part.rout,
  });
  if (ch.feedback) res(`RF:${ch.id}`, out, ch.feedback.to === 'plus' ? plus : minus, ch.feedback.ohms);
  if (ch.pullup) res(`RP:${ch.id}`, node(ch.pullup.to), out, ch.pullup.ohms);
  if (ch.led) {
    net.diodes.push({
      id: `D:${ch.id}`,
      kind: 'led',
      anode: node(ch.led.anode),
      cathode: out,
      knee: ch.led.knee,
      rSeries: ch.led.ohms,
      rdyn: ch.led.rdyn,
      seriesId: `RL:${ch.id}`,
      channel: ch.id,
    });
  }
}
