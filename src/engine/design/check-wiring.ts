/**
 * Checks how a design file wires things together: node names, unique ids, package slots and
 * wired-OR ties. Works on the file form; values are read elsewhere.
 */
import type { DesignFile } from './file-types';
import { joinPath } from './problems';
import type { Reader } from './reader';

const FIXED_NODES = ['gnd', 'supply', 'ref', 'in'];
const TAP = /^T([1-9]\d*)$/;

/** What node names exist in a design. */
interface NodeSpace {
  taps: number;
  channels: Set<string>;
  rails: Set<string>;
}

function tapsText(taps: number): string {
  if (taps === 0) return 'the string has no taps';
  return taps === 1 ? 'the only tap is T1' : `taps are T1..T${taps}`;
}

function alternatives(space: NodeSpace): string {
  const rails = [...space.rails].join(', ');
  return `use in, ref, supply, gnd, out:<channel id>${rails ? `, or a rail (${rails})` : ''}`;
}

/** Why `node` is not a node of the design, or undefined when it is one. */
export function nodeError(node: string, space: NodeSpace): string | undefined {
  if (FIXED_NODES.includes(node) || space.rails.has(node)) return undefined;
  const tap = TAP.exec(node);
  if (tap) {
    if (Number(tap[1]) <= space.taps) return undefined;
    return `no such node; ${tapsText(space.taps)}, or ${alternatives(space)}`;
  }
  if (node.startsWith('out:')) {
    const id = node.slice(4);
    if (space.channels.has(id)) return undefined;
    return `no channel "${id}"; channels are ${[...space.channels].join(', ') || '(none)'}`;
  }
  return `no such node; ${tapsText(space.taps)}, or ${alternatives(space)}`;
}

/**
 * Records a problem for every unknown node, duplicate id, reused slot or bad wired-OR tie.
 * A tie needs naming on one side only (A.wiredTo = B ties A and B); naming it on both is fine.
 */
export function checkWiring(file: DesignFile, reader: Reader): void {
  const rails = file.rails ?? [];
  const spares = file.spares ?? [];
  const space: NodeSpace = {
    taps: file.string.length - 1,
    channels: new Set(file.channels.map((c) => c.id)),
    rails: new Set(),
  };
  rails.forEach((rail, i) => {
    const path = joinPath(joinPath('rails', i), 'id');
    if (FIXED_NODES.includes(rail.id) || TAP.test(rail.id)) {
      reader.problem(path, rail.id, 'this name is taken by a built-in node or a tap; pick another rail name, e.g. "logic"');
    } else if (space.rails.has(rail.id)) {
      reader.problem(path, rail.id, 'rail names must be unique; rename one of them');
    } else {
      space.rails.add(rail.id);
    }
  });
  const node = (value: string, path: string) => {
    const error = nodeError(value, space);
    if (error) reader.problem(path, value, error);
  };
  const slots = new Map<string, string>();
  const slot = (pkg: number, ch: number, path: string, value: unknown) => {
    const key = `${pkg}/${ch}`;
    const taken = slots.get(key);
    if (taken) reader.problem(path, value, `package ${pkg} channel ${ch} is already used by ${taken}; pick a free slot`);
    else slots.set(key, path);
  };
  const seen = new Set<string>();
  file.channels.forEach((c, i) => {
    const at = joinPath('channels', i);
    if (seen.has(c.id)) reader.problem(joinPath(at, 'id'), c.id, 'channel ids must be unique; rename this channel');
    seen.add(c.id);
    slot(c.package, c.channel, joinPath(at, 'channel'), c.channel);
    node(c.plus, joinPath(at, 'plus'));
    node(c.minus, joinPath(at, 'minus'));
    if (c.plus === c.minus && !nodeError(c.plus, space)) {
      reader.problem(joinPath(at, 'minus'), c.minus, 'both inputs are on the same node, so the channel can never decide; move one input');
    }
    if (c.pullup) node(c.pullup.to, joinPath(joinPath(at, 'pullup'), 'to'));
    if (c.led) node(c.led.anode, joinPath(joinPath(at, 'led'), 'anode'));
    if (c.feedback?.to === 'minus') {
      reader.warn(joinPath(joinPath(at, 'feedback'), 'to'), 'feedback to the inverting input is negative feedback; a comparator needs it on plus for hysteresis');
    }
    if (c.wiredTo !== undefined) {
      const path = joinPath(at, 'wiredTo');
      if (c.wiredTo === c.id) reader.problem(path, c.wiredTo, 'a channel cannot be tied to itself; name another channel or remove wiredTo');
      else if (!space.channels.has(c.wiredTo)) reader.problem(path, c.wiredTo, `no such channel; channels are ${[...space.channels].join(', ')}`);
    }
  });
  spares.forEach((s, i) => {
    const at = joinPath('spares', i);
    slot(s.package, s.channel, joinPath(at, 'channel'), s.channel);
    node(s.plus, joinPath(at, 'plus'));
    node(s.minus, joinPath(at, 'minus'));
  });
  const packages = new Set([...file.channels, ...spares].map((c) => c.package));
  for (let p = 1; p < Math.max(0, ...packages); p++) {
    if (!packages.has(p)) reader.warn('channels', `package ${p} has no channels; number packages from 1 without gaps`);
  }
}
