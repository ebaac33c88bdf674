// The revisions API contract: request bodies (zod) and response shapes, shared by the server and the app.
import { z } from 'zod';

export const revisionCreateBody = z.strictObject({
  note: z.string({ error: 'note must be text' }).trim().max(2000, 'note must be at most 2000 characters').default(''),
});

export const REVIEW_VERDICTS = ['reviewed', 'approved'] as const;
export type ReviewVerdict = (typeof REVIEW_VERDICTS)[number];

export const reviewCreateBody = z.strictObject({
  verdict: z.enum(REVIEW_VERDICTS, { error: 'verdict must be reviewed or approved' }),
  comment: z.string({ error: 'comment must be text' }).trim().max(4000, 'comment must be at most 4000 characters').default(''),
});

export const revisionNumberParam = z.coerce
  .number({ error: 'revision must be a number' })
  .int('revision must be a whole number')
  .min(1, 'revision numbers start at 1')
  .max(1_000_000, 'revision number is too large');

export type RevisionCreateBody = z.infer<typeof revisionCreateBody>;
export type ReviewCreateBody = z.infer<typeof reviewCreateBody>;

export interface ReviewSummary {
  id: string;
  verdict: ReviewVerdict;
  comment: string;
  reviewer: { id: string | null; name: string; viaLink: boolean };
  createdAt: string;
}

/** One case (the base case or a what-if) in a few figures: enough to list and compare at a glance. */
export interface CaseSummary {
  whatIfId: string | null;
  name: string;
  ok: boolean;
  error?: string;
  /** Highest and lowest load voltage as a percent of its rating, and where. */
  highestLoad?: { name: string; percentOfRating: number; volts: number };
  lowestLoad?: { name: string; percentOfRating: number; volts: number };
  sourceKw?: number;
  /** A shunt-fault what-if: the fault current. */
  faultKa?: number;
}

export interface RevisionSummary {
  id: string;
  sheetId: string;
  number: number;
  note: string;
  inputHash: string;
  solverVersion: string;
  issuedAt: string;
  issuedBy: { id: string | null; name: string };
  /** approved once anyone approved it, reviewed once anyone reviewed it, else issued. */
  status: 'issued' | 'reviewed' | 'approved';
  reviews: ReviewSummary[];
  cases: CaseSummary[];
}

export interface RevisionDetail extends RevisionSummary {
  /** The frozen sheet document (the sheet JSON format). */
  document: Record<string, unknown>;
}

export interface ElementChange {
  id: string;
  name: string;
  kind: string;
  /** Dotted paths of the fields that differ (for changed elements). */
  fields?: string[];
}

export interface VoltageMove {
  key: string;
  elementId: string;
  name: string;
  /** What was measured, e.g. "A–N" or a load's "A–N" element label. */
  label: string;
  revisionVolts: number | null;
  liveVolts: number | null;
  /** live − revision; null when one side has no value (de-energised or removed). */
  changeVolts: number | null;
}

export interface RevisionComparison {
  revision: number;
  identical: boolean;
  liveHash: string;
  revisionHash: string;
  elements: { added: ElementChange[]; removed: ElementChange[]; changed: ElementChange[] };
  connections: { added: string[]; removed: string[]; changed: string[] };
  whatIfs: { added: ElementChange[]; removed: ElementChange[]; changed: ElementChange[] };
  settings: string[];
  /** The sheet was renamed in its project's list since the revision (the name is part of what a revision holds). */
  renamed: { from: string; to: string } | null;
  /** Base-case voltages that moved by at least VOLTAGE_MOVE_THRESHOLD volts, largest first. */
  voltages: VoltageMove[];
  voltageThresholdVolts: number;
}

export interface ListRevisionsResponse {
  revisions: RevisionSummary[];
}
export interface RevisionResponse {
  revision: RevisionDetail;
}
