// The nodal block of a series element between two sets of pins: [[Y, −Y], [−Y, Y]].
import type { ComplexMatrix } from '../complex';
import { zeros } from '../complex';

export function twoPortStamp(y: ComplexMatrix): ComplexMatrix {
  const n = y.length;
  const out = zeros(2 * n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      const v = y[i][j];
      out[i][j] = { re: v.re, im: v.im };
      out[i + n][j + n] = { re: v.re, im: v.im };
      out[i][j + n] = { re: -v.re, im: -v.im };
      out[i + n][j] = { re: -v.re, im: -v.im };
    }
  }
  return out;
}
