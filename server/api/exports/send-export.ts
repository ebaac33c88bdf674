// Sends one export of a sheet or a revision: its JSON document, its drawing as SVG or PNG, its results as CSV, or
// (for a revision) its report as PDF. The heavy ones (PNG, PDF, solves) are made in the worker thread.
import type { Response } from 'express';
import type { RevisionSummary } from '../../../shared/revisions';
import { HttpError } from '../../http/errors';
import { drawingSvg } from '../../exports/drawing-svg';
import { resultsCsv } from '../../exports/results-csv';
import type { StudyResults } from '../../revisions/study';
import type { WorkerPool } from '../../workers/worker-pool';

export const EXPORT_FILES = ['document.json', 'drawing.svg', 'drawing.png', 'results.csv', 'report.pdf'] as const;
export type ExportFile = (typeof EXPORT_FILES)[number];

export interface ExportSource {
  workers: WorkerPool;
  /** The download's file name without its extension. */
  baseName: string;
  document: Record<string, unknown>;
  /** The study results; `baseOnly` says the caller needs only the base case (drawings). */
  results: (baseOnly: boolean) => Promise<StudyResults>;
  /** Present for a revision: what its report's title block says. */
  report?: { projectName: string; sheetName: string; revision: RevisionSummary };
}

/** A file name safe in a header: our own characters only, the full name in the RFC 5987 form beside it. */
export function attachment(res: Response, fileName: string) {
  const plain = fileName.replace(/[^A-Za-z0-9._-]+/g, '-').replace(/-+/g, '-');
  res.setHeader('Content-Disposition', `attachment; filename="${plain}"; filename*=UTF-8''${encodeURIComponent(fileName)}`);
}

export async function sendExport(res: Response, file: ExportFile, src: ExportSource): Promise<void> {
  const [stem, ext] = file.split('.');
  const name = `${src.baseName}-${stem}.${ext}`;
  switch (file) {
    case 'document.json': {
      attachment(res, `${src.baseName}.json`);
      res.type('application/json').send(JSON.stringify(src.document, null, 2));
      return;
    }
    case 'drawing.svg': {
      const results = await src.results(true);
      const { svg } = drawingSvg(src.document, { base: results.base.result ?? null });
      attachment(res, name);
      res.type('image/svg+xml').send(svg);
      return;
    }
    case 'drawing.png': {
      const results = await src.results(true);
      const d = drawingSvg(src.document, { base: results.base.result ?? null });
      const png = await src.workers.run('png', d);
      attachment(res, name);
      res.type('image/png').send(Buffer.from(png));
      return;
    }
    case 'results.csv': {
      attachment(res, name);
      res.type('text/csv; charset=utf-8').send(resultsCsv(await src.results(false)));
      return;
    }
    case 'report.pdf': {
      if (!src.report) throw new HttpError(404, 'not_found', 'A report is made for an issued revision: issue one, then download its report');
      const pdf = await src.workers.run('report', {
        ...src.report,
        document: src.document,
        results: await src.results(false),
        generatedAt: new Date().toISOString(),
      });
      attachment(res, `${src.baseName}-report.pdf`);
      res.type('application/pdf').send(Buffer.from(pdf));
      return;
    }
  }
}
