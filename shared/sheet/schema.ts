// The sheet's JSON format, version 1, as zod schemas: settings, elements, connections and what-ifs, all maps keyed by id.
// Every field is a plain leaf (or a one-level map of leaves) so that a Yjs document can hold it field by field and
// concurrent edits of different fields merge. Units are in the field names.
import { z } from 'zod';
import { AWG_KCMIL_SIZES, CONDUCTOR_MATERIALS, METRIC_SIZES_MM2, RACEWAY_KINDS } from '../conductor-sizes';

export const SHEET_FORMAT_VERSION = 1;

/** Conductors of a terminal: three phases, the neutral and the protective (equipment grounding) conductor. */
export const CONDUCTOR_IDS = ['A', 'B', 'C', 'N', 'PE'] as const;
export type ConductorId = (typeof CONDUCTOR_IDS)[number];
export const PHASE_IDS = ['A', 'B', 'C'] as const;
export type PhaseId = (typeof PHASE_IDS)[number];

export const conductorIdSchema = z.enum(CONDUCTOR_IDS, { error: 'conductor must be one of A, B, C, N, PE' });
export const phaseIdSchema = z.enum(PHASE_IDS, { error: 'phase must be one of A, B, C' });

const idString = z.string({ error: 'id is required' }).trim().min(1, 'id must not be empty').max(120, 'id is too long');
const label = z.string().max(200, 'name must be at most 200 characters').default('');
const finite = () => z.number({ error: 'must be a number' });
const positive = (what: string) => finite().positive(`${what} must be greater than zero`);
const nonNegative = (what: string) => finite().min(0, `${what} must not be negative`);
const fraction = (what: string) => finite().min(0, `${what} must be between 0 and 1`).max(1, `${what} must be between 0 and 1`);

/** Where the element sits on the drawing (a later issue's canvas); electrically meaningless. */
const placement = {
  x: finite().default(0),
  y: finite().default(0),
  rotationDeg: finite().default(0),
};
const common = { id: idString, name: label, ...placement };

// ---------------------------------------------------------------------------------------------------------------
// Settings

export const settingsSchema = z.object({
  frequencyHz: z.union([z.literal(60), z.literal(50)], { error: 'frequencyHz must be 60 or 50' }).default(60),
  voltageStandard: z.enum(['ansi-c84.1', 'iec-60038'], { error: 'voltageStandard must be ansi-c84.1 or iec-60038' }).default('ansi-c84.1'),
  phaseColors: z.enum(['north-american', 'iec-60445'], { error: 'phaseColors must be north-american or iec-60445' }).default('north-american'),
  /** Below this fraction of its rated voltage a constant-current or constant-power load turns to constant impedance. */
  lowVoltageSwitchFraction: fraction('lowVoltageSwitchFraction').default(0.7),
  /** Earth resistivity for Carson's equations (overhead runs). */
  earthResistivityOhmM: positive('earthResistivityOhmM').default(100),
  /** Load iteration stops when every load's current mismatch is below this fraction of its rated current. */
  loadMismatchTolerance: positive('loadMismatchTolerance').max(0.01, 'loadMismatchTolerance must be at most 0.01').default(1e-9),
  maxLoadIterations: finite().int('maxLoadIterations must be a whole number').min(1).max(10000).default(200),
});
export type SheetSettings = z.output<typeof settingsSchema>;

// ---------------------------------------------------------------------------------------------------------------
// Elements

const grounding = z.enum(['solid', 'resistance', 'ungrounded'], { error: 'grounding must be solid, resistance or ungrounded' });

export const sourceSchema = z
  .object({
    kind: z.literal('source'),
    ...common,
    /** three-phase-wye and -delta, single-phase (A–N) or split-phase 120/240 (A and B about N). */
    system: z.enum(['three-phase-wye', 'three-phase-delta', 'single-phase', 'split-phase']).default('three-phase-wye'),
    /** Line-to-line for three-phase and split-phase (240 for 120/240), line-to-neutral for single-phase. */
    nominalVolts: positive('nominalVolts'),
    /** Operating voltage as a fraction of nominal (1.03 is 3 % above). */
    voltsPerUnit: positive('voltsPerUnit').max(2, 'voltsPerUnit must be at most 2').default(1),
    /** Angle of phase A's line-to-neutral voltage. */
    angleDeg: finite().default(0),
    /** infinite: an ideal source; otherwise its impedance from the fault current, the short-circuit MVA or ohms. */
    strength: z.enum(['infinite', 'fault-current', 'short-circuit-mva', 'impedance']).default('infinite'),
    faultCurrentKa: positive('faultCurrentKa').optional(),
    shortCircuitMva: positive('shortCircuitMva').optional(),
    xOverR: nonNegative('xOverR').default(10),
    /** |Z0| / |Z1| for fault-current and short-circuit-mva strengths (same angle as Z1). */
    zeroToPositiveRatio: positive('zeroToPositiveRatio').default(1),
    r1Ohms: nonNegative('r1Ohms').optional(),
    x1Ohms: finite().optional(),
    r0Ohms: nonNegative('r0Ohms').optional(),
    x0Ohms: finite().optional(),
    grounding: grounding.default('solid'),
    groundingOhms: nonNegative('groundingOhms').default(0),
    interruptingKa: positive('interruptingKa').optional(),
  })
  .superRefine((s, ctx) => {
    if (s.strength === 'fault-current' && s.faultCurrentKa === undefined) {
      ctx.addIssue({ code: 'custom', path: ['faultCurrentKa'], message: 'strength fault-current needs faultCurrentKa' });
    }
    if (s.strength === 'short-circuit-mva' && s.shortCircuitMva === undefined) {
      ctx.addIssue({ code: 'custom', path: ['shortCircuitMva'], message: 'strength short-circuit-mva needs shortCircuitMva' });
    }
    if (s.strength === 'impedance' && (s.r1Ohms === undefined || s.x1Ohms === undefined)) {
      ctx.addIssue({ code: 'custom', path: ['r1Ohms'], message: 'strength impedance needs r1Ohms and x1Ohms' });
    }
    if (s.strength === 'impedance' && s.r1Ohms === 0 && s.x1Ohms === 0) {
      ctx.addIssue({ code: 'custom', path: ['x1Ohms'], message: 'a zero impedance is an infinite source: use strength infinite' });
    }
    if (s.grounding === 'resistance' && !(s.groundingOhms > 0)) {
      ctx.addIssue({ code: 'custom', path: ['groundingOhms'], message: 'grounding resistance needs groundingOhms above zero' });
    }
    if (s.system === 'three-phase-delta' && s.grounding !== 'ungrounded') {
      ctx.addIssue({ code: 'custom', path: ['grounding'], message: 'a delta source has no neutral: its grounding must be ungrounded' });
    }
  });

export const TRANSFORMER_CONNECTIONS = [
  'delta-wye-grounded',
  'wye-grounded-wye-grounded',
  'delta-delta',
  'high-leg-delta',
  'open-delta',
  'single-phase',
  'single-phase-center-tapped',
] as const;
export type TransformerConnection = (typeof TRANSFORMER_CONNECTIONS)[number];
/** IEC vector groups; Dyn1 is the ANSI delta–wye (low side lags the high side by 30°). */
export const VECTOR_GROUPS = ['Dyn1', 'Dyn11', 'YNyn0', 'Dd0'] as const;
export type VectorGroup = (typeof VECTOR_GROUPS)[number];
const ALLOWED_GROUPS: Record<TransformerConnection, readonly VectorGroup[]> = {
  'delta-wye-grounded': ['Dyn1', 'Dyn11'],
  'wye-grounded-wye-grounded': ['YNyn0'],
  'delta-delta': ['Dd0'],
  'high-leg-delta': ['Dd0'],
  'open-delta': ['Dd0'],
  'single-phase': [],
  'single-phase-center-tapped': [],
};
/** The vector group used when the sheet gives none. */
export function defaultVectorGroup(connection: TransformerConnection): VectorGroup | undefined {
  return ALLOWED_GROUPS[connection][0];
}

const neutralGrounding = z.enum(['solid', 'resistance', 'none'], { error: 'neutral grounding must be solid, resistance or none' });

export const transformerSchema = z
  .object({
    kind: z.literal('transformer'),
    ...common,
    connection: z.enum(TRANSFORMER_CONNECTIONS),
    vectorGroup: z.enum(VECTOR_GROUPS).optional(),
    /** The bank's rating. */
    kva: positive('kva'),
    /** Line-to-line for three-phase banks; the winding voltage for single-phase units. */
    primaryVolts: positive('primaryVolts'),
    /** Line-to-line for three-phase banks; the full winding (240 for 120/240) for single-phase units. */
    secondaryVolts: positive('secondaryVolts'),
    percentImpedance: positive('percentImpedance').max(50, 'percentImpedance must be at most 50').default(2),
    xOverR: nonNegative('xOverR').default(4),
    /** Primary tap in percent of rated primary volts; a positive tap lowers the secondary voltage. */
    tapPercent: finite().min(-20).max(20).default(0),
    /** Magnetising current in percent of rated current; 0 leaves only a negligible branch that keeps windings determinate. */
    excitingCurrentPercent: nonNegative('excitingCurrentPercent').max(20).default(0),
    /** Grounding of the primary wye neutral (H0) to remote earth. */
    primaryGrounding: neutralGrounding.default('none'),
    primaryGroundingOhms: nonNegative('primaryGroundingOhms').default(0),
    /** Grounding of the secondary neutral (X0) to remote earth at the transformer itself. */
    secondaryGrounding: neutralGrounding.default('none'),
    secondaryGroundingOhms: nonNegative('secondaryGroundingOhms').default(0),
  })
  .superRefine((t, ctx) => {
    const allowed = ALLOWED_GROUPS[t.connection];
    if (t.vectorGroup !== undefined && !allowed.includes(t.vectorGroup)) {
      ctx.addIssue({
        code: 'custom',
        path: ['vectorGroup'],
        message:
          allowed.length === 0
            ? `a ${t.connection} transformer has no vector group`
            : `vector group ${t.vectorGroup} does not fit a ${t.connection} transformer (use ${allowed.join(' or ')})`,
      });
    }
    if (t.primaryGrounding === 'resistance' && !(t.primaryGroundingOhms > 0)) {
      ctx.addIssue({ code: 'custom', path: ['primaryGroundingOhms'], message: 'resistance grounding needs primaryGroundingOhms above zero' });
    }
    if (t.secondaryGrounding === 'resistance' && !(t.secondaryGroundingOhms > 0)) {
      ctx.addIssue({ code: 'custom', path: ['secondaryGroundingOhms'], message: 'resistance grounding needs secondaryGroundingOhms above zero' });
    }
  });

export const BUS_ROLES = ['service', 'panel', 'switchboard', 'separately-derived', 'junction'] as const;

export const busSchema = z.object({
  kind: z.literal('bus'),
  ...common,
  /** service: the service point (ANSI service range); separately-derived: the first bus of a separately derived system. */
  role: z.enum(BUS_ROLES).default('panel'),
  phaseA: z.boolean().default(true),
  phaseB: z.boolean().default(true),
  phaseC: z.boolean().default(true),
  neutralBar: z.boolean().default(true),
  groundBar: z.boolean().default(true),
  /** The main bonding jumper between the neutral bar and the ground bar. */
  neutralGroundBond: z.boolean().default(false),
  ratingAmperes: positive('ratingAmperes').optional(),
  interruptingKa: positive('interruptingKa').optional(),
});

const awgKcmil = z.enum(AWG_KCMIL_SIZES, { error: `size must be one of ${AWG_KCMIL_SIZES.join(', ')}` });
const metricSize = z.union(
  METRIC_SIZES_MM2.map((mm2) => z.literal(mm2)),
  { error: `sizeMm2 must be one of ${METRIC_SIZES_MM2.join(', ')}` },
);

/** One conductor of a run: its size and material, whether it is open, and the data its impedance source needs. */
export const runConductorSchema = z.object({
  size: awgKcmil.optional(),
  sizeMm2: metricSize.optional(),
  material: z.enum(CONDUCTOR_MATERIALS).default('copper'),
  open: z.boolean().default(false),
  /** custom impedance per length. */
  rOhmsPer1000Ft: nonNegative('rOhmsPer1000Ft').optional(),
  xOhmsPer1000Ft: finite().optional(),
  /** overhead geometry for Carson's equations. */
  xFt: finite().optional(),
  yFt: finite().optional(),
  gmrFt: positive('gmrFt').optional(),
  rOhmsPerMile: nonNegative('rOhmsPerMile').optional(),
});

export const IMPEDANCE_SOURCES = ['nec-table9', 'iec-60228', 'custom', 'overhead'] as const;

export const runSchema = z
  .object({
    kind: z.literal('run'),
    ...common,
    lengthFt: positive('lengthFt'),
    parallelSets: finite().int('parallelSets must be a whole number').min(1, 'parallelSets must be at least 1').default(1),
    /** Where the impedance per length comes from. */
    impedanceFrom: z.enum(IMPEDANCE_SOURCES).default('nec-table9'),
    raceway: z.enum(RACEWAY_KINDS).default('pvc'),
    insulationTempC: z.union([z.literal(60), z.literal(75), z.literal(90)], { error: 'insulationTempC must be 60, 75 or 90' }).default(75),
    ambientC: finite().min(-40).max(90).default(30),
    /** Current-carrying conductors in the raceway for ampacity adjustment; counted from the run when not given. */
    conductorsInRaceway: finite().int().min(1).optional(),
    conductors: z.partialRecord(conductorIdSchema, runConductorSchema),
  })
  .superRefine((r, ctx) => {
    const entries = Object.entries(r.conductors) as [ConductorId, z.output<typeof runConductorSchema>][];
    if (entries.length === 0) ctx.addIssue({ code: 'custom', path: ['conductors'], message: 'a run needs at least one conductor' });
    for (const [id, k] of entries) {
      const at = (field: string) => ['conductors', id, field];
      if (r.impedanceFrom === 'nec-table9' && k.size === undefined) {
        ctx.addIssue({ code: 'custom', path: at('size'), message: `conductor ${id} needs a size (AWG or kcmil) for NEC Table 9` });
      }
      if (r.impedanceFrom === 'iec-60228' && k.sizeMm2 === undefined) {
        ctx.addIssue({ code: 'custom', path: at('sizeMm2'), message: `conductor ${id} needs sizeMm2 for IEC 60228` });
      }
      if (r.impedanceFrom === 'custom' && (k.rOhmsPer1000Ft === undefined || k.xOhmsPer1000Ft === undefined)) {
        ctx.addIssue({ code: 'custom', path: at('rOhmsPer1000Ft'), message: `conductor ${id} needs rOhmsPer1000Ft and xOhmsPer1000Ft` });
      }
      if (r.impedanceFrom === 'custom' && k.rOhmsPer1000Ft === 0 && k.xOhmsPer1000Ft === 0) {
        ctx.addIssue({ code: 'custom', path: at('rOhmsPer1000Ft'), message: `conductor ${id} has zero impedance: use a connection instead` });
      }
      if (r.impedanceFrom === 'overhead') {
        for (const f of ['xFt', 'yFt', 'gmrFt', 'rOhmsPerMile'] as const) {
          if (k[f] === undefined) ctx.addIssue({ code: 'custom', path: at(f), message: `conductor ${id} needs ${f} for an overhead run` });
        }
      }
    }
  });

export const POLE_STATES = ['closed', 'open', 'none'] as const;
const poleState = z.enum(POLE_STATES, { error: 'pole must be closed, open or none' });

export const breakerSchema = z.object({
  kind: z.literal('breaker'),
  ...common,
  device: z.enum(['breaker', 'switch', 'fuse']).default('breaker'),
  /** Each pole closed, open, or none (the device has no pole on that phase). */
  poleA: poleState.default('closed'),
  poleB: poleState.default('closed'),
  poleC: poleState.default('closed'),
  /** Unswitched neutral and protective conductors pass through from the line to the load terminal. */
  carriesNeutral: z.boolean().default(true),
  carriesGround: z.boolean().default(true),
  ratingAmperes: positive('ratingAmperes').optional(),
  interruptingKa: positive('interruptingKa').default(10),
});

export const LOAD_CONNECTIONS = ['line-to-neutral', 'line-to-line', 'three-phase-wye', 'three-phase-delta'] as const;
export type LoadConnection = (typeof LOAD_CONNECTIONS)[number];
export const LOAD_KINDS = ['lighting', 'receptacles', 'motor', 'electronics', 'heating'] as const;
export type LoadKind = (typeof LOAD_KINDS)[number];

export const loadSchema = z
  .object({
    kind: z.literal('load'),
    ...common,
    connection: z.enum(LOAD_CONNECTIONS).default('line-to-neutral'),
    loadKind: z.enum(LOAD_KINDS).default('receptacles'),
    /** The amount is given as real power (kw) or as line current (amperes), with the power factor. */
    givenAs: z.enum(['kw', 'amperes']).default('kw'),
    kw: nonNegative('kw').default(0),
    amperes: nonNegative('amperes').default(0),
    powerFactor: finite().gt(0, 'powerFactor must be above 0').max(1, 'powerFactor must be at most 1').default(1),
    leading: z.boolean().default(false),
    /** Nameplate voltage: line-to-neutral for line-to-neutral loads, line-to-line for every other connection. */
    ratedVolts: positive('ratedVolts'),
    /** Behaviour with voltage; when none is given the load kind decides (solver/README.md). */
    constantImpedanceFraction: fraction('constantImpedanceFraction').optional(),
    constantCurrentFraction: fraction('constantCurrentFraction').optional(),
    constantPowerFraction: fraction('constantPowerFraction').optional(),
    /** Unbalanced three-phase loads: kW per element (A, B, C; for delta A is A–B, B is B–C, C is C–A). Replaces kw. */
    phaseKw: z.partialRecord(phaseIdSchema, nonNegative('phaseKw')).optional(),
    phasePowerFactor: z.partialRecord(phaseIdSchema, finite().gt(0).max(1)).optional(),
    /** Motors only (ignored for other kinds, so a kind changed later loses nothing): during a fault the motor feeds it
     *  as a source behind its subtransient reactance [false]. */
    contributesToFaults: z.boolean().optional(),
    /** Subtransient reactance X"d, per unit on the motor's own kVA [0.17, solver/faults/motor-contribution.ts]. */
    subtransientReactancePu: positive('subtransientReactancePu').max(1, 'subtransientReactancePu must be at most 1').optional(),
  })
  .superRefine((l, ctx) => {
    const fractions = [l.constantImpedanceFraction, l.constantCurrentFraction, l.constantPowerFraction];
    const given = fractions.filter((f) => f !== undefined) as number[];
    if (given.length > 0) {
      const sum = given.reduce((a, b) => a + b, 0);
      if (Math.abs(sum - 1) > 1e-9 && given.length === 3) {
        ctx.addIssue({ code: 'custom', path: ['constantImpedanceFraction'], message: `load behaviour fractions add up to ${sum}, not 1` });
      }
      if (sum > 1 + 1e-9) {
        ctx.addIssue({ code: 'custom', path: ['constantImpedanceFraction'], message: `load behaviour fractions add up to ${sum}, more than 1` });
      }
    }
    const threePhase = l.connection === 'three-phase-wye' || l.connection === 'three-phase-delta';
    if ((l.phaseKw || l.phasePowerFactor) && !threePhase) {
      ctx.addIssue({ code: 'custom', path: ['phaseKw'], message: 'phaseKw and phasePowerFactor apply only to three-phase loads' });
    }
    if (l.phaseKw && l.givenAs !== 'kw') {
      ctx.addIssue({ code: 'custom', path: ['phaseKw'], message: 'phaseKw needs givenAs kw' });
    }
  });

export const electrodeSchema = z.object({
  kind: z.literal('electrode'),
  ...common,
  /** Resistance to remote earth; 0 ties the lead solidly to earth. */
  ohms: nonNegative('ohms').default(25),
});

export const elementSchema = z.discriminatedUnion(
  'kind',
  [sourceSchema, transformerSchema, busSchema, runSchema, breakerSchema, loadSchema, electrodeSchema],
  { error: 'kind must be source, transformer, bus, run, breaker, load or electrode' },
);

// ---------------------------------------------------------------------------------------------------------------
// Connections

export const endSchema = z.object({ elementId: idString, terminal: z.string().min(1, 'terminal must not be empty') });

export const connectionSchema = z
  .object({
    id: idString,
    from: endSchema,
    to: endSchema,
    /** Which conductor of the 'from' end (key) lands on which conductor of the 'to' end (value). */
    conductorMap: z.partialRecord(conductorIdSchema, conductorIdSchema),
  })
  .superRefine((c, ctx) => {
    const targets = Object.values(c.conductorMap);
    if (targets.length === 0) ctx.addIssue({ code: 'custom', path: ['conductorMap'], message: 'a connection must map at least one conductor' });
    const seen = new Set<string>();
    for (const t of targets) {
      if (seen.has(t!)) ctx.addIssue({ code: 'custom', path: ['conductorMap'], message: `two conductors land on ${t} of the 'to' end` });
      seen.add(t!);
    }
  });

// ---------------------------------------------------------------------------------------------------------------
// What-ifs: data over the base case

export const SHUNT_FAULT_TYPES = ['three-phase', 'line-to-ground', 'line-to-line', 'double-line-to-ground', 'line-to-neutral'] as const;

export const changeSchema = z.discriminatedUnion(
  'kind',
  [
    z.object({ kind: z.literal('open-conductor'), runId: idString, conductor: conductorIdSchema }),
    /** A resistance added in series with one conductor of a run (a failing splice or lug at its end). */
    z.object({ kind: z.literal('degrade-conductor'), runId: idString, conductor: conductorIdSchema, addedOhms: positive('addedOhms') }),
    z.object({ kind: z.literal('open-pole'), breakerId: idString, pole: phaseIdSchema }),
    /** Conductor is named at the connection's 'from' end. */
    z.object({ kind: z.literal('open-connection'), connectionId: idString, conductor: conductorIdSchema }),
    z.object({ kind: z.literal('degrade-connection'), connectionId: idString, conductor: conductorIdSchema, ohms: positive('ohms') }),
    /** Scales every load downstream of a bus (or only the panel's own loads, up to the next bus). */
    z.object({
      kind: z.literal('scale-loads'),
      elementId: idString,
      factor: nonNegative('factor').max(100),
      scope: z.enum(['downstream', 'panel']).default('downstream'),
    }),
    /** A shunt fault at a bus through faultOhms + j faultReactanceOhms (both 0: bolted); one per what-if. */
    z.object({
      kind: z.literal('shunt-fault'),
      busId: idString,
      faultType: z.enum(SHUNT_FAULT_TYPES),
      phases: z.partialRecord(phaseIdSchema, z.boolean()).optional(),
      to: z.enum(['PE', 'N', 'earth']).default('PE'),
      /** Resistance of the fault path. */
      faultOhms: nonNegative('faultOhms').default(0),
      /** Reactance of the fault path (added later; older documents without it read as 0, a resistive fault). */
      faultReactanceOhms: nonNegative('faultReactanceOhms').default(0),
    }),
  ],
  { error: 'change kind must be open-conductor, degrade-conductor, open-pole, open-connection, degrade-connection, scale-loads or shunt-fault' },
);

export const whatIfSchema = z.object({
  id: idString,
  name: label,
  changes: z.record(z.string(), changeSchema).default({}),
});

// ---------------------------------------------------------------------------------------------------------------
// The sheet

export const sheetSchema = z
  .object({
    formatVersion: z.literal(SHEET_FORMAT_VERSION, { error: `formatVersion must be ${SHEET_FORMAT_VERSION}` }),
    name: label,
    settings: settingsSchema.prefault({}),
    elements: z.record(z.string(), elementSchema).default({}),
    connections: z.record(z.string(), connectionSchema).default({}),
    whatIfs: z.record(z.string(), whatIfSchema).default({}),
  })
  .superRefine((s, ctx) => {
    for (const group of ['elements', 'connections', 'whatIfs'] as const) {
      for (const [key, value] of Object.entries(s[group])) {
        if (value.id !== key) {
          ctx.addIssue({ code: 'custom', path: [group, key, 'id'], message: `id "${value.id}" differs from its key "${key}"` });
        }
      }
    }
  });

export type Sheet = z.output<typeof sheetSchema>;
export type SheetInput = z.input<typeof sheetSchema>;
export type SheetElement = z.output<typeof elementSchema>;
export type ElementKind = SheetElement['kind'];
export type SourceElement = z.output<typeof sourceSchema>;
export type TransformerElement = z.output<typeof transformerSchema>;
export type BusElement = z.output<typeof busSchema>;
export type RunElement = z.output<typeof runSchema>;
export type RunConductor = z.output<typeof runConductorSchema>;
export type BreakerElement = z.output<typeof breakerSchema>;
export type LoadElement = z.output<typeof loadSchema>;
export type ElectrodeElement = z.output<typeof electrodeSchema>;
export type Connection = z.output<typeof connectionSchema>;
export type WhatIf = z.output<typeof whatIfSchema>;
export type WhatIfChange = z.output<typeof changeSchema>;
export type ShuntFaultType = (typeof SHUNT_FAULT_TYPES)[number];
