// Converts a sheet (and a what-if's modifications) into the network: every element's pins, ties and stamps,
// every connection's ties, and the nominal voltages. Problems in the sheet become warnings, never exceptions.
import type { Sheet } from '../../shared/sheet';
import { BuilderContext } from './builder-context';
import { buildBreaker } from './switch';
import { buildBus } from './bus';
import { buildConnection } from './connection';
import { buildElectrode } from './electrode';
import { buildLoad } from './load';
import { buildRun } from './run';
import { buildSource } from './source';
import { buildTransformer } from './transformer';
import type { Modifications } from './modifications';
import { NO_MODIFICATIONS } from './modifications';
import { nominalVoltages, type NominalVoltages } from './nominal';
import type { Network } from './types';

export interface BuiltNetwork extends Network {
  zoneVolts: Float64Array;
  transformers: BuilderContext['transformers'];
}

export function buildNetwork(sheet: Sheet, mods: Modifications = NO_MODIFICATIONS): BuiltNetwork {
  const ctx = new BuilderContext(sheet, mods);
  for (const element of Object.values(sheet.elements)) {
    try {
      switch (element.kind) {
        case 'source':
          buildSource(ctx, element);
          break;
        case 'transformer':
          buildTransformer(ctx, element);
          break;
        case 'bus':
          buildBus(ctx, element);
          break;
        case 'run':
          buildRun(ctx, element);
          break;
        case 'breaker':
          buildBreaker(ctx, element);
          break;
        case 'load':
          buildLoad(ctx, element);
          break;
        case 'electrode':
          buildElectrode(ctx, element);
          break;
      }
    } catch (error) {
      ctx.warn(`${element.kind} ${element.id}: ${(error as Error).message}; it is left out`, element.id);
    }
  }
  for (const connection of Object.values(sheet.connections)) buildConnection(ctx, connection);
  const nominal: NominalVoltages = nominalVoltages(ctx);
  return {
    pins: ctx.pins,
    pinIndex: ctx.pinIndex,
    ties: ctx.ties,
    stamps: ctx.stamps,
    loads: ctx.loads,
    runs: ctx.runs,
    sources: ctx.sources,
    transformers: ctx.transformers,
    nominal: nominal.phasors,
    zoneVolts: nominal.zoneVolts,
    warnings: ctx.warnings,
    assumptions: [...ctx.assumptions],
  };
}
