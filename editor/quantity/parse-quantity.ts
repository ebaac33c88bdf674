// Reads what a person types into a numeric field: a plain number in the field's unit, an expression
// ("208/sqrt(3)"), or a quantity with a unit of the same kind ("45 m" into a field in feet), all through mathjs.
// The mathjs instance is limited to arithmetic: no imports, no new units, no evaluation of strings inside.
import { all, create, type MathJsInstance, type Unit } from 'mathjs';

/** The unit a field stores its number in (the unit in the sheet format's field name). */
export type FieldUnit = 'ft' | 'V' | 'A' | 'kA' | 'kW' | 'kVA' | 'MVA' | 'ohm' | 'percent' | 'degC' | 'number';

export type QuantityResult = { ok: true; value: number } | { ok: false; message: string };

const KIND: Record<FieldUnit, string> = {
  ft: 'a length',
  V: 'a voltage',
  A: 'a current',
  kA: 'a current',
  kW: 'a power',
  kVA: 'an apparent power',
  MVA: 'an apparent power',
  ohm: 'a resistance',
  percent: 'a percentage',
  degC: 'a temperature',
  number: 'a plain number',
};

const EXAMPLE: Record<FieldUnit, string> = {
  ft: '150 ft or 45 m',
  V: '208 or 208/sqrt(3)',
  A: '42 or 0.2 kA',
  kA: '22 or 22000 A',
  kW: '1.5 or 1500 W',
  kVA: '150 or 0.15 MVA',
  MVA: '250',
  ohm: '25 or 25 ohm',
  percent: '2.5',
  degC: '30',
  number: '1.5',
};

let instance: MathJsInstance | undefined;

function math(): MathJsInstance {
  if (instance) return instance;
  const m = create(all);
  const evaluate = m.evaluate;
  const refuse = (name: string) => () => {
    throw new Error(`${name} is not allowed here`);
  };
  m.import(
    {
      import: refuse('import'),
      createUnit: refuse('createUnit'),
      evaluate: refuse('evaluate'),
      parse: refuse('parse'),
      simplify: refuse('simplify'),
      derivative: refuse('derivative'),
      resolve: refuse('resolve'),
    },
    { override: true },
  );
  instance = Object.assign(Object.create(m), { evaluate }) as MathJsInstance;
  return instance;
}

function isUnit(v: unknown): v is Unit {
  return typeof v === 'object' && v !== null && (v as { type?: string }).type === 'Unit';
}

/** Parses `text` into a number in `unit`; the message says what was wrong and gives an example. */
export function parseQuantity(text: string, unit: FieldUnit): QuantityResult {
  const hint = `enter ${KIND[unit]}, such as ${EXAMPLE[unit]}`;
  let source = text.trim().replace(/Ω/g, ' ohm').replace(/°\s*C\b/g, '');
  if (source === '') return { ok: false, message: `Empty: ${hint}` };
  if (unit === 'percent') source = source.replace(/%\s*$/, '');
  let value: unknown;
  try {
    value = math().evaluate(source);
  } catch {
    return { ok: false, message: `Cannot read "${text.trim()}": ${hint}` };
  }
  let out: number;
  if (typeof value === 'number') out = value;
  else if (isUnit(value)) {
    if (unit === 'number' || unit === 'percent' || unit === 'degC') {
      return { ok: false, message: `"${text.trim()}" has a unit; ${hint}` };
    }
    const target = unit === 'ohm' ? 'ohm' : unit;
    if (!value.equalBase(math().unit(target))) return { ok: false, message: `"${text.trim()}" is not ${KIND[unit]}: ${hint}` };
    if (value.value === null) return { ok: false, message: `"${text.trim()}" has a unit but no number: ${hint}` };
    out = value.toNumber(target);
  } else if (typeof value === 'object' && value !== null && (value as { type?: string }).type === 'BigNumber') {
    out = Number(value);
  } else {
    return { ok: false, message: `"${text.trim()}" is not a single number: ${hint}` };
  }
  if (!Number.isFinite(out)) return { ok: false, message: `"${text.trim()}" is not a finite number: ${hint}` };
  return { ok: true, value: out };
}

/** A number as a field shows it: up to 6 significant figures, no trailing zeros. */
export function formatQuantity(value: number | undefined | null): string {
  if (value === undefined || value === null || !Number.isFinite(value)) return '';
  return String(Number(value.toPrecision(6)));
}
