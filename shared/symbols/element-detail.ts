// The short second line under an element's name on the drawing: its size in the trade's words.
/** The fields read here, from a stored (unvalidated) element. */
type ElementFields = { kind: string; [field: string]: unknown };

const num = (v: unknown) => (typeof v === 'number' && Number.isFinite(v) ? v : undefined);
const fmt = (v: number) => String(Number(v.toPrecision(4)));

export function elementDetail(e: ElementFields): string {
  switch (e.kind) {
    case 'source': {
      const v = num(e.nominalVolts);
      return v ? `${fmt(v)} V` : '';
    }
    case 'transformer': {
      const kva = num(e.kva);
      return kva ? `${fmt(kva)} kVA` : '';
    }
    case 'run': {
      const len = num(e.lengthFt);
      const conductors = (e.conductors ?? {}) as Record<string, { size?: string; material?: string } | undefined>;
      const phase = conductors.A ?? conductors.B ?? conductors.C;
      const size = phase?.size ? ` · ${phase.size}${phase.material === 'aluminum' ? ' Al' : ' Cu'}` : '';
      return len ? `${fmt(len)} ft${size}` : '';
    }
    case 'breaker': {
      const a = num(e.ratingAmperes);
      return a ? `${fmt(a)} A` : '';
    }
    case 'load': {
      const kw = num(e.kw);
      const amps = num(e.amperes);
      return e.givenAs === 'amperes' ? (amps !== undefined ? `${fmt(amps)} A` : '') : kw !== undefined ? `${fmt(kw)} kW` : '';
    }
    case 'electrode': {
      const ohms = num(e.ohms);
      return ohms !== undefined ? `${fmt(ohms)} Ω` : '';
    }
    default:
      return '';
  }
}
