// Revision rows: issued once (numbered per sheet), read, and marked by reviews. Nothing here updates a revision.
import { and, asc, desc, eq, inArray, max } from 'drizzle-orm';
import type { Database } from '../../../db/client';
import { projectMember, revision, revisionReview, user } from '../../../db/schema';
import type { CaseSummary, ReviewSummary, ReviewVerdict, RevisionSummary } from '../../../shared/revisions';
import type { StudyResults } from '../../revisions/study';
import { caseSummary } from '../../revisions/summaries';

export type RevisionRow = typeof revision.$inferSelect;

export interface NewRevision {
  sheetId: string;
  note: string;
  state: Uint8Array;
  document: Record<string, unknown>;
  inputHash: string;
  solverVersion: string;
  results: StudyResults;
  issuedBy: { id: string; name: string };
}

const isUniqueViolation = (err: unknown) => /revision_sheet_number_idx|duplicate key/i.test(String((err as { cause?: unknown })?.cause ?? err));

/** Inserts the next number of the sheet; two issues at once both succeed, one number apart. */
export async function insertRevision(db: Database, r: NewRevision): Promise<RevisionRow> {
  for (let attempt = 0; ; attempt++) {
    try {
      return await db.transaction(async (tx) => {
        const [{ last }] = await tx.select({ last: max(revision.number) }).from(revision).where(eq(revision.sheetId, r.sheetId));
        const [row] = await tx
          .insert(revision)
          .values({
            sheetId: r.sheetId,
            number: (last ?? 0) + 1,
            note: r.note,
            state: r.state,
            document: r.document,
            inputHash: r.inputHash,
            solverVersion: r.solverVersion,
            results: r.results,
            cases: casesOf(r.results),
            issuedBy: r.issuedBy.id,
            issuedByName: r.issuedBy.name,
          })
          .returning();
        return row;
      });
    } catch (err) {
      if (attempt < 3 && isUniqueViolation(err)) continue;
      throw err;
    }
  }
}

export async function findRevision(db: Database, sheetId: string, number: number): Promise<RevisionRow | null> {
  const [row] = await db.select().from(revision).where(and(eq(revision.sheetId, sheetId), eq(revision.number, number))).limit(1);
  return row ?? null;
}

const listColumns = {
  id: revision.id,
  sheetId: revision.sheetId,
  number: revision.number,
  note: revision.note,
  inputHash: revision.inputHash,
  solverVersion: revision.solverVersion,
  issuedAt: revision.issuedAt,
  issuedBy: revision.issuedBy,
  issuedByName: revision.issuedByName,
  cases: revision.cases,
};

type ListRow = { [K in keyof typeof listColumns]: RevisionRow[K] };

async function reviewsOf(db: Database, revisionIds: string[]): Promise<Map<string, ReviewSummary[]>> {
  const out = new Map<string, ReviewSummary[]>();
  if (revisionIds.length === 0) return out;
  const rows = await db.select().from(revisionReview).where(inArray(revisionReview.revisionId, revisionIds)).orderBy(asc(revisionReview.createdAt));
  for (const r of rows) {
    const list = out.get(r.revisionId) ?? [];
    list.push({
      id: r.id,
      verdict: r.verdict,
      comment: r.comment,
      reviewer: { id: r.reviewerId, name: r.reviewerName, viaLink: r.viaLink },
      createdAt: r.createdAt.toISOString(),
    });
    out.set(r.revisionId, list);
  }
  return out;
}

export function casesOf(results: StudyResults): CaseSummary[] {
  return [results.base, ...results.whatIfs].map(caseSummary);
}

function toSummary(row: ListRow, reviews: ReviewSummary[]): RevisionSummary {
  const status = reviews.some((r) => r.verdict === 'approved') ? 'approved' : reviews.length > 0 ? 'reviewed' : 'issued';
  return {
    id: row.id,
    sheetId: row.sheetId,
    number: row.number,
    note: row.note,
    inputHash: row.inputHash,
    solverVersion: row.solverVersion,
    issuedAt: row.issuedAt.toISOString(),
    issuedBy: { id: row.issuedBy, name: row.issuedByName },
    status,
    reviews,
    cases: row.cases as CaseSummary[],
  };
}

export async function listRevisions(db: Database, sheetId: string): Promise<RevisionSummary[]> {
  const rows = await db.select(listColumns).from(revision).where(eq(revision.sheetId, sheetId)).orderBy(desc(revision.number));
  const reviews = await reviewsOf(db, rows.map((r) => r.id));
  return rows.map((r) => toSummary(r, reviews.get(r.id) ?? []));
}

export async function revisionSummary(db: Database, row: RevisionRow): Promise<RevisionSummary> {
  const reviews = await reviewsOf(db, [row.id]);
  return toSummary(row, reviews.get(row.id) ?? []);
}

export async function addReview(
  db: Database,
  input: { revisionId: string; reviewer: { id: string; name: string }; verdict: ReviewVerdict; comment: string; viaLink: boolean },
): Promise<ReviewSummary> {
  const [r] = await db
    .insert(revisionReview)
    .values({
      revisionId: input.revisionId,
      reviewerId: input.reviewer.id,
      reviewerName: input.reviewer.name,
      verdict: input.verdict,
      comment: input.comment,
      viaLink: input.viaLink,
    })
    .returning();
  return { id: r.id, verdict: r.verdict, comment: r.comment, reviewer: { id: r.reviewerId, name: r.reviewerName, viaLink: r.viaLink }, createdAt: r.createdAt.toISOString() };
}

/** The e-mail addresses of a project's owners (real accounts), less the one who acted. */
export async function ownerEmails(db: Database, projectId: string, exceptUserId: string | null): Promise<string[]> {
  const rows = await db
    .select({ id: user.id, email: user.email, isAnonymous: user.isAnonymous })
    .from(projectMember)
    .innerJoin(user, eq(user.id, projectMember.userId))
    .where(and(eq(projectMember.projectId, projectId), eq(projectMember.role, 'owner')));
  return rows.filter((r) => !r.isAnonymous && r.id !== exceptUserId).map((r) => r.email);
}
