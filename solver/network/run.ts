// A cable or feeder run: the primitive impedance matrix of all its conductors (neutral and PE included), times
// length, over parallel sets, inverted and stamped as a two-port. An open conductor is taken out before the
// inversion (its entries stay in the pattern as zeros); a degraded one gets its added resistance in series.
import type { Complex, ComplexMatrix } from '../complex';
import { matInverse, scale, zeros } from '../complex';
import { carsonPrimitiveOhmsPerMile, iecImpedancePerKm, necAcImpedancePer1000Ft } from '../conductors';
import type { ConductorId, RunElement, SheetSettings } from '../../shared/sheet';
import { byConductorOrder } from '../../shared/sheet';
import type { BuilderContext } from './builder-context';
import { runConductorKey } from './modifications';
import { twoPortStamp } from './two-port';

const FEET_PER_MILE = 5280;
const KM_PER_FOOT = 0.0003048;

/** Series impedance matrix of the run as built (no openings), ohms, conductors in A, B, C, N, PE order. */
export function runImpedanceOhms(run: RunElement, settings: SheetSettings): { ids: ConductorId[]; z: ComplexMatrix; mutual: boolean } {
  const ids = (Object.keys(run.conductors) as ConductorId[]).sort(byConductorOrder);
  const perSet = 1 / run.parallelSets;
  const z = zeros(ids.length);
  if (run.impedanceFrom === 'overhead') {
    const perMile = carsonPrimitiveOhmsPerMile(
      ids.map((id) => {
        const k = run.conductors[id]!;
        return { xFt: k.xFt!, yFt: k.yFt!, gmrFt: k.gmrFt!, rOhmsPerMile: k.rOhmsPerMile! };
      }),
      settings.frequencyHz,
      settings.earthResistivityOhmM,
    );
    const k = (run.lengthFt / FEET_PER_MILE) * perSet;
    return { ids, z: perMile.map((row) => row.map((v) => scale(v, k))), mutual: true };
  }
  ids.forEach((id, i) => {
    const k = run.conductors[id]!;
    let ohms: { rOhms: number; xOhms: number };
    let lengthUnits: number;
    switch (run.impedanceFrom) {
      case 'nec-table9': {
        const perKft = necAcImpedancePer1000Ft(k.size!, k.material, run.raceway);
        // Table 9 is a 60 Hz table: reactance scales with frequency.
        ohms = { rOhms: perKft.rOhms, xOhms: perKft.xOhms * (settings.frequencyHz / 60) };
        lengthUnits = run.lengthFt / 1000;
        break;
      }
      case 'iec-60228':
        ohms = iecImpedancePerKm(k.sizeMm2!, k.material, settings.frequencyHz);
        lengthUnits = run.lengthFt * KM_PER_FOOT;
        break;
      default:
        ohms = { rOhms: k.rOhmsPer1000Ft!, xOhms: k.xOhmsPer1000Ft! };
        lengthUnits = run.lengthFt / 1000;
    }
    z[i][i] = { re: ohms.rOhms * lengthUnits * perSet, im: ohms.xOhms * lengthUnits * perSet };
  });
  return { ids, z, mutual: false };
}

/** Admittance of the closed conductors (zero rows and columns for open ones), or undefined when all are open. */
export function runAdmittance(z: ComplexMatrix, open: boolean[], addedOhms: number[]): ComplexMatrix {
  const n = z.length;
  const closed = [...Array(n).keys()].filter((i) => !open[i]);
  const y = zeros(n);
  if (closed.length === 0) return y;
  const zc: ComplexMatrix = closed.map((i) =>
    closed.map((j) => (i === j ? { re: z[i][j].re + addedOhms[i], im: z[i][j].im } : { ...z[i][j] })),
  );
  const yc = matInverse(zc);
  closed.forEach((i, a) => closed.forEach((j, b) => (y[i][j] = yc[a][b])));
  return y;
}

export function buildRun(ctx: BuilderContext, run: RunElement): void {
  const settings = ctx.sheet.settings;
  let impedance: { ids: ConductorId[]; z: ComplexMatrix; mutual: boolean };
  try {
    impedance = runImpedanceOhms(run, settings);
  } catch (error) {
    ctx.warn(`run ${run.id}: ${(error as Error).message}; the run is left out (treated as open)`, run.id);
    return;
  }
  const { ids, z, mutual } = impedance;
  const open = ids.map((id) => run.conductors[id]!.open || ctx.mods.openRunConductors.has(runConductorKey(run.id, id)));
  const added = ids.map((id) => ctx.mods.addedRunOhms.get(runConductorKey(run.id, id)) ?? 0);
  let y: ComplexMatrix;
  try {
    y = runAdmittance(z, open, added);
  } catch {
    ctx.warn(`run ${run.id}: its impedance matrix cannot be inverted; the run is left out (treated as open)`, run.id);
    y = zeros(ids.length);
  }
  const fromPins = ids.map((id) => ctx.pin(run.id, 'from', id));
  const toPins = ids.map((id) => ctx.pin(run.id, 'to', id));
  const stampIndex = ctx.stamp({
    kind: 'run',
    elementId: run.id,
    pins: [...fromPins, ...toPins],
    y: twoPortStamp(y),
    galvanic: ids.flatMap((_, i) => (open[i] ? [] : [[fromPins[i], toPins[i]] as [number, number]])),
  });
  ctx.runs.push({
    runId: run.id,
    stampIndex,
    conductors: ids.map((conductor, i) => ({ conductor, fromPin: fromPins[i], toPin: toPins[i], open: open[i], addedOhms: added[i] })),
    impedanceOhms: z,
    mutualCoupling: mutual,
  });
  if (run.impedanceFrom === 'nec-table9') {
    ctx.assume(
      'NEC Chapter 9 Table 9 gives positive-sequence ohms (three conductors in conduit, 75 °C): each conductor gets its R and X with no mutual coupling. Right for voltage drop; approximate for neutral and ground return paths.',
    );
  }
  if (run.impedanceFrom === 'iec-60228') {
    ctx.assume('IEC 60228 runs: DC resistance at 70 °C with a typical multicore reactance, no mutual coupling between conductors.');
  }
  if (run.impedanceFrom === 'custom') ctx.assume('Custom impedances per length are used as given, with no mutual coupling.');
  if (run.impedanceFrom === 'overhead') {
    ctx.assume(`Overhead runs: modified Carson's equations with earth resistivity ${settings.earthResistivityOhmM} Ω·m, full mutual coupling.`);
  }
}

