// Command line: npm run solve -- <sheet.json> [--what-if <id>] [--loading] [--json]. Prints the results (or, with
// --loading, the loading and voltage-drop study) as tables, or as JSON.
// Exit codes: 0 solved, 1 the solve failed, 2 the file or its arguments are invalid.
import { readFileSync } from 'node:fs';
import { readSheet } from '../shared/sheet';
import { solveSheet } from './solve/solve-sheet';
import { formatResults } from './results/format-table';
import { loadingStudy } from './studies/loading-study';
import { formatLoadingStudy } from './studies/format-loading';

const USAGE = 'usage: npm run solve -- <sheet.json> [--what-if <id>] [--loading] [--json]';

function parseArgs(argv: string[]): { file: string; whatIfId?: string; json: boolean; loading: boolean } | string {
  let file: string | undefined;
  let whatIfId: string | undefined;
  let json = false;
  let loading = false;
  for (let i = 0; i < argv.length; i++) {
    const arg = argv[i];
    if (arg === '--json') json = true;
    else if (arg === '--loading') loading = true;
    else if (arg === '--what-if') {
      whatIfId = argv[++i];
      if (!whatIfId) return '--what-if needs the id of a what-if';
    } else if (arg.startsWith('--what-if=')) whatIfId = arg.slice('--what-if='.length);
    else if (arg === '--help' || arg === '-h') return USAGE;
    else if (arg.startsWith('-')) return `unknown option ${arg}`;
    else if (file) return `one sheet at a time (got ${file} and ${arg})`;
    else file = arg;
  }
  if (!file) return 'give the sheet file to solve';
  return { file, whatIfId, json, loading };
}

function main(argv: string[]): number {
  const args = parseArgs(argv);
  if (typeof args === 'string') {
    console.error(args === USAGE ? USAGE : `${args}\n${USAGE}`);
    return 2;
  }
  let text: string;
  try {
    text = readFileSync(args.file, 'utf8');
  } catch (error) {
    console.error(`cannot read ${args.file}: ${(error as Error).message}`);
    return 2;
  }
  let document: unknown;
  try {
    document = JSON.parse(text);
  } catch (error) {
    console.error(`${args.file} is not JSON: ${(error as Error).message}`);
    return 2;
  }
  const read = readSheet(document);
  if (!read.ok) {
    console.error(`${args.file} is not a valid sheet:`);
    for (const issue of read.issues) console.error(`  ${issue.path || '(document)'}: ${issue.message}`);
    return 2;
  }
  const outcome = solveSheet(read.sheet, {
    whatIfId: args.whatIfId,
    readWarnings: read.warnings.map((w) => ({ message: w.message, ...(w.elementId ? { elementId: w.elementId } : {}) })),
  });
  if (!outcome.ok) {
    if (args.json) console.log(JSON.stringify({ ok: false, error: outcome.error }, null, 2));
    console.error(`the solve failed (${outcome.error.code}): ${outcome.error.message}`);
    return outcome.error.code === 'unknown-what-if' ? 2 : 1;
  }
  if (args.loading) {
    const studied = loadingStudy(read.sheet, { result: outcome.result, ...(args.whatIfId ? { whatIfId: args.whatIfId } : {}) });
    if (!studied.ok) {
      console.error(`the loading study failed (${studied.error.code}): ${studied.error.message}`);
      return 1;
    }
    console.log(args.json ? JSON.stringify(studied.study, null, 2) : formatLoadingStudy(studied.study));
    return 0;
  }
  console.log(args.json ? JSON.stringify(outcome.result, null, 2) : formatResults(outcome.result));
  return 0;
}

process.exitCode = main(process.argv.slice(2));
