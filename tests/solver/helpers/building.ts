// A small 208Y/120 building for tests: service with bond and electrode, a feeder to a panel through a breaker,
// a two-phase apartment feeder (A and C of the building) and a few loads.
import { SheetBuilder, customRun } from './sheet-builder';

const FEEDER: [number, number] = [0.062, 0.041]; // NEC Chapter 9 Table 9, 4/0 copper in PVC (seen)

export function building(): SheetBuilder {
  return new SheetBuilder('building', {})
    .source('utility', { nominalVolts: 208, strength: 'fault-current', faultCurrentKa: 20, xOverR: 6, zeroToPositiveRatio: 1.5 })
    .bus('service', { role: 'service', neutralGroundBond: true, ratingAmperes: 400 })
    .electrode('rod', 25)
    .breaker('cb-panel', { ratingAmperes: 200 })
    .run('feeder', customRun(150, { A: FEEDER, B: FEEDER, C: FEEDER, N: FEEDER, PE: [0.31, 0.048] }))
    .bus('panel', { ratingAmperes: 200 })
    .breaker('cb-apt', { poleB: 'none', ratingAmperes: 100 })
    .run('apt-feeder', customRun(80, { A: [0.12, 0.044], B: [0.12, 0.044], N: [0.12, 0.044], PE: [0.49, 0.051] }))
    .bus('apt', { phaseC: false })
    .load('heat-a', { connection: 'line-to-neutral', ratedVolts: 120, kw: 3, loadKind: 'heating' })
    .load('lights-b', { connection: 'line-to-neutral', ratedVolts: 120, kw: 1.2, powerFactor: 0.95, loadKind: 'lighting' })
    .load('range', { connection: 'line-to-line', ratedVolts: 208, kw: 5, loadKind: 'heating' })
    .load('apt-kitchen', { connection: 'line-to-neutral', ratedVolts: 120, kw: 1.8, loadKind: 'receptacles' })
    .load('apt-bed', { connection: 'line-to-neutral', ratedVolts: 120, kw: 0.4, loadKind: 'electronics' })
    .load('motor', { connection: 'three-phase-delta', ratedVolts: 208, kw: 7.5, powerFactor: 0.85, loadKind: 'motor' })
    .connect('utility', 'out', 'service', 'bars', ['A', 'B', 'C', 'N'], 'c-service')
    .connect('service', 'bars', 'rod', 'lead', ['PE'], 'c-rod')
    .connect('service', 'bars', 'cb-panel', 'line', ['A', 'B', 'C', 'N', 'PE'], 'c-cb')
    .connect('cb-panel', 'load', 'feeder', 'from', ['A', 'B', 'C', 'N', 'PE'], 'c-feeder-from')
    .connect('feeder', 'to', 'panel', 'bars', ['A', 'B', 'C', 'N', 'PE'], 'c-panel')
    .connect('panel', 'bars', 'heat-a', 'supply', { A: 'A', N: 'N' }, 'c-heat')
    .connect('panel', 'bars', 'lights-b', 'supply', { B: 'A', N: 'N' }, 'c-lights')
    .connect('panel', 'bars', 'range', 'supply', { A: 'A', B: 'B' }, 'c-range')
    .connect('panel', 'bars', 'motor', 'supply', ['A', 'B', 'C'], 'c-motor')
    .connect('panel', 'bars', 'cb-apt', 'line', ['A', 'C', 'N', 'PE'], 'c-apt-cb')
    // the apartment's two bus bars are fed from phases A and C of the panel
    .connect('cb-apt', 'load', 'apt-feeder', 'from', { A: 'A', C: 'B', N: 'N', PE: 'PE' }, 'c-apt-feeder')
    .connect('apt-feeder', 'to', 'apt', 'bars', ['A', 'B', 'N', 'PE'], 'c-apt')
    .connect('apt', 'bars', 'apt-kitchen', 'supply', { A: 'A', N: 'N' }, 'c-kitchen')
    .connect('apt', 'bars', 'apt-bed', 'supply', { B: 'A', N: 'N' }, 'c-bed');
}
