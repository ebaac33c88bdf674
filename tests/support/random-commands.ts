// Random but valid commands of the sheet model, from a seeded generator (the style of Yjs's own randomised tests).
import * as prng from 'lib0/prng';
import * as Y from 'yjs';
import { SheetCommands } from '../../editor/document/commands';
import { collection } from '../../editor/document/sheet-doc';

const keysOf = (doc: Y.Doc, name: 'elements' | 'connections' | 'whatIfs') => [...collection(doc, name).keys()].sort();
const kindOf = (doc: Y.Doc, id: string) => collection(doc, 'elements').get(id)?.get('kind');

export function randomCommand(gen: prng.PRNG, cmd: SheetCommands, tag: string, n: number): string {
  const doc = cmd.doc;
  const elements = keysOf(doc, 'elements');
  const buses = elements.filter((id) => kindOf(doc, id) === 'bus');
  const loads = elements.filter((id) => kindOf(doc, id) === 'load');
  const connections = keysOf(doc, 'connections');
  const whatIfs = keysOf(doc, 'whatIfs');
  const roll = prng.int32(gen, 0, 99);
  const x = prng.int32(gen, 0, 2000);
  const y = prng.int32(gen, 0, 2000);
  if (roll < 15 || elements.length < 3) {
    const id = `${tag}-${n}`;
    const which = prng.int32(gen, 0, 2);
    if (which === 0) cmd.addElement({ kind: 'bus', id, name: `Panel ${id}`, x, y, role: 'panel' });
    else if (which === 1) cmd.addElement({ kind: 'load', id, name: `Load ${id}`, x, y, kw: prng.int32(gen, 1, 50) / 10, ratedVolts: 120 });
    else cmd.addElement({ kind: 'source', id, name: `Source ${id}`, x, y, nominalVolts: 208 });
    return `add ${id}`;
  }
  if (roll < 35) {
    const id = prng.oneOf(gen, elements);
    cmd.moveElements([{ id, x, y }]);
    return `move ${id}`;
  }
  if (roll < 50) {
    const id = prng.oneOf(gen, elements);
    const kind = kindOf(doc, id);
    if (kind === 'load' && prng.bool(gen)) cmd.setField('elements', id, ['kw'], prng.int32(gen, 0, 90) / 10);
    else if (kind === 'bus' && prng.bool(gen)) cmd.setField('elements', id, ['neutralGroundBond'], prng.bool(gen));
    else cmd.setField('elements', id, ['name'], prng.word(gen, 1, 12));
    return `set ${id}`;
  }
  if (roll < 58) {
    const id = prng.oneOf(gen, elements);
    cmd.deleteElements([id]);
    return `delete ${id}`;
  }
  if (roll < 72 && buses.length > 0 && loads.length > 0) {
    const from = prng.oneOf(gen, buses);
    const to = prng.oneOf(gen, loads);
    const phase = prng.oneOf(gen, ['A', 'B', 'C'] as const);
    cmd.connect({ id: `${tag}-c${n}`, from: { elementId: from, terminal: 'bars' }, to: { elementId: to, terminal: 'supply' }, conductorMap: { [phase]: 'A', N: 'N' } });
    return `connect ${from}->${to}`;
  }
  if (roll < 78 && connections.length > 0) {
    const id = prng.oneOf(gen, connections);
    cmd.disconnect(id);
    return `disconnect ${id}`;
  }
  if (roll < 86 || whatIfs.length === 0) {
    const id = cmd.addWhatIf(`What-if ${tag} ${n}`, `${tag}-w${n}`);
    return `what-if ${id}`;
  }
  const w = prng.oneOf(gen, whatIfs);
  if (roll < 95 && connections.length > 0) {
    cmd.addChange(w, { kind: 'open-connection', connectionId: prng.oneOf(gen, connections), conductor: 'N' }, `${tag}-ch${n}`);
    return `change ${w}`;
  }
  if (roll < 98) {
    cmd.setField('whatIfs', w, ['name'], prng.word(gen, 1, 10));
    return `rename ${w}`;
  }
  cmd.removeWhatIf(w);
  return `remove ${w}`;
}
