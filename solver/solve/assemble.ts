// Builds the scaled nodal system over the classes: Y from every stamp (explicit zeros kept, so openings keep the
// pattern), the known voltages (EMF offsets, earth) moved to the right-hand side, one reference tie per ungrounded
// part and a unit tie per de-energised class. Rows and columns are scaled by each zone's voltage (D Y D).
import type { BuiltNetwork } from '../network/build-network';
import { MatrixAssembly, type ComplexCsc } from '../linear-system';
import type { PinClasses } from './classes';
import type { Parts } from './parts';

/** Reference tie of an ungrounded part, relative to the part's largest scaled diagonal. */
const REFERENCE_TIE_FRACTION = 1e-3;

export interface AssembledSystem {
  matrix: ComplexCsc;
  /** Right-hand side of the base case (known voltages only), scaled rows. */
  rhsRe: Float64Array;
  rhsIm: Float64Array;
  /** Zone voltage of each class: V(class) = scale × x. */
  scale: Float64Array;
}

export function assemble(network: BuiltNetwork, classes: PinClasses, parts: Parts): AssembledSystem {
  const n = classes.classCount;
  const scale = new Float64Array(n).fill(1);
  for (let cls = 0; cls < n; cls++) {
    let v = 0;
    for (const pin of classes.members[cls]) v = Math.max(v, network.zoneVolts[pin]);
    scale[cls] = v > 0 ? v : 1;
  }
  const { classOf, offsetRe, offsetIm } = classes;
  const assembly = new MatrixAssembly(n, network.stamps.reduce((s, st) => s + st.pins.length ** 2, n));
  const rhsRe = new Float64Array(n);
  const rhsIm = new Float64Array(n);
  const diagAbs = new Float64Array(n);
  for (const stamp of network.stamps) {
    const k = stamp.pins.length;
    for (let i = 0; i < k; i++) {
      const r = classOf[stamp.pins[i]];
      if (r < 0) continue; // a row of the earth class: its current goes to the reference
      for (let j = 0; j < k; j++) {
        const y = stamp.y[i][j];
        const pj = stamp.pins[j];
        const s = classOf[pj];
        // V(pj) = V(s) + offset(pj): the offset's share moves to the right-hand side.
        const oRe = offsetRe[pj];
        const oIm = offsetIm[pj];
        if (oRe !== 0 || oIm !== 0) {
          rhsRe[r] -= y.re * oRe - y.im * oIm;
          rhsIm[r] -= y.re * oIm + y.im * oRe;
        }
        if (s < 0) continue;
        const f = scale[r] * scale[s];
        assembly.add(r, s, y.re * f, y.im * f);
        if (r === s) diagAbs[r] += Math.hypot(y.re, y.im) * f;
      }
    }
  }
  for (let r = 0; r < n; r++) {
    rhsRe[r] *= scale[r];
    rhsIm[r] *= scale[r];
  }
  let typicalDiag = 0;
  for (let r = 0; r < n; r++) typicalDiag = Math.max(typicalDiag, diagAbs[r]);
  if (!(typicalDiag > 0)) typicalDiag = 1;
  for (let r = 0; r < n; r++) {
    // Every class keeps a diagonal entry, so that pattern and analysis survive openings.
    const tie = parts.isolated[r] ? typicalDiag : 0;
    assembly.add(r, r, tie, 0);
  }
  // A reference tie per ungrounded part, sized to the part (its current is zero: the part has no other earth path).
  for (const r of parts.referenceTies) assembly.add(r, r, REFERENCE_TIE_FRACTION * (diagAbs[r] || typicalDiag), 0);
  return { matrix: assembly.toMatrix(), rhsRe, rhsIm, scale };
}
