// The study report of a revision as PDF (pdfkit, the drawing through svg-to-pdfkit), made in the worker thread:
// title block, cautions, the drawing, the base case, the what-ifs, the fault study, further studies where they
// exist, panel schedules, and the data and assumptions used. Every page names the revision and repeats the caution.
import PDFDocument from 'pdfkit';
import SVGtoPDF from 'svg-to-pdfkit';
import { readSheet, type Sheet } from '../../shared/sheet';
import { CAUTION } from '../../solver/results/derive';
import type { SolveResult } from '../../solver';
import { drawingSvg, SVG_FONTS } from '../exports/drawing-svg';
import { FONT_FILES } from '../exports/fonts';
import { caseSummary } from '../revisions/summaries';
import { PLANNED_STUDIES, type StudyTable } from './extra-studies';
import { panelSchedules } from './panel-schedules';
import type { ReportInput } from './report-input';

const M = 50;
const INK = '#1E2830';
const MUTED = '#5B666E';
const RULE = '#C9C1AE';
const BAND = '#F4EFE3';

type Cell = string | number | null | undefined;
interface Column {
  title: string;
  width: number;
  align?: 'left' | 'right';
}

const v1 = (x: number | null | undefined, digits = 1) => (typeof x === 'number' && Number.isFinite(x) ? x.toFixed(digits) : '—');
const dateOf = (iso: string) => new Date(iso).toISOString().slice(0, 16).replace('T', ' ') + ' UTC';

/** svg-to-pdfkit names a font family; these are the fonts registered from assets/fonts. */
const pickFont = (family: string) => (family.includes('Mono') ? 'mono' : family.includes('SemiBold') ? 'bold' : 'text');

class Report {
  readonly doc: PDFKit.PDFDocument;
  y = M;

  constructor(
    private readonly footer: string,
    private readonly paper: 'LETTER' | 'A4',
  ) {
    this.doc = new PDFDocument({ size: paper, margins: { top: M, bottom: M, left: M, right: M }, bufferPages: true, autoFirstPage: false, info: { Title: footer, Creator: 'Phasewright' } });
    this.doc.registerFont('text', FONT_FILES.text);
    this.doc.registerFont('bold', FONT_FILES.textBold);
    this.doc.registerFont('mono', FONT_FILES.mono);
    this.page();
  }

  get width() {
    return this.doc.page.width - 2 * M;
  }

  page(layout: 'portrait' | 'landscape' = 'portrait') {
    this.doc.addPage({ size: this.paper, layout, margins: { top: M, bottom: M, left: M, right: M } });
    this.y = M;
  }

  private room(h: number) {
    if (this.y + h > this.doc.page.height - M - 24) this.page();
  }

  /** A heading; `keep` reserves room for what must follow it on the same page (a figure). */
  heading(text: string, level: 1 | 2 = 1, keep = 40) {
    const size = level === 1 ? 15 : 11.5;
    this.room(size + keep);
    this.y += level === 1 ? 10 : 6;
    this.doc.font('bold').fontSize(size).fillColor(INK).text(text, M, this.y, { width: this.width });
    this.y = this.doc.y + 4;
    if (level === 1) {
      this.doc.moveTo(M, this.y).lineTo(M + this.width, this.y).lineWidth(0.8).strokeColor(RULE).stroke();
      this.y += 6;
    }
  }

  /** A paragraph; `keep` reserves room for what must follow it on the same page (a table's header and first rows). */
  para(text: string, options: { size?: number; color?: string; font?: string; keep?: number } = {}) {
    const size = options.size ?? 9.5;
    this.doc.font(options.font ?? 'text').fontSize(size);
    const h = this.doc.heightOfString(text, { width: this.width });
    this.room(h + (options.keep ?? 0));
    this.doc.fillColor(options.color ?? INK).text(text, M, this.y, { width: this.width });
    this.y = this.doc.y + 4;
  }

  bullets(lines: string[]) {
    for (const l of lines) this.para(`•  ${l}`, { size: 9 });
  }

  /** A table that breaks across pages, repeating its header; columns scaled to the page width. */
  table(columns: Column[], rows: Cell[][], options: { size?: number } = {}) {
    const size = options.size ?? 8;
    const total = columns.reduce((a, c) => a + c.width, 0);
    const widths = columns.map((c) => (c.width / total) * this.width);
    const pad = 3;
    const rowHeight = (cells: string[], font: string) => {
      this.doc.font(font).fontSize(size);
      return Math.max(...cells.map((c, i) => this.doc.heightOfString(c, { width: widths[i] - 2 * pad }))) + 2 * pad;
    };
    const draw = (cells: string[], font: string, fill?: string) => {
      const h = rowHeight(cells, font);
      if (fill) this.doc.rect(M, this.y, this.width, h).fill(fill);
      let x = M;
      this.doc.font(font).fontSize(size).fillColor(INK);
      cells.forEach((c, i) => {
        this.doc.text(c, x + pad, this.y + pad, { width: widths[i] - 2 * pad, align: columns[i].align ?? 'left' });
        x += widths[i];
      });
      this.y += h;
      this.doc.moveTo(M, this.y).lineTo(M + this.width, this.y).lineWidth(0.4).strokeColor(RULE).stroke();
    };
    const header = columns.map((c) => c.title);
    this.room(rowHeight(header, 'bold') + 16);
    draw(header, 'bold', BAND);
    for (const row of rows) {
      const cells = row.map((c) => (c === null || c === undefined ? '—' : String(c)));
      // A row with only its first cell (a "… and N more" line) spans the table.
      if (cells.length > 1 && cells.slice(1).every((c) => c === '')) {
        this.doc.font('text').fontSize(size);
        const h = this.doc.heightOfString(cells[0], { width: this.width - 2 * pad }) + 2 * pad;
        if (this.y + h > this.doc.page.height - M - 24) this.page();
        this.doc.fillColor(MUTED).text(cells[0], M + pad, this.y + pad, { width: this.width - 2 * pad });
        this.y += h;
        continue;
      }
      const h = rowHeight(cells, 'text');
      if (this.y + h > this.doc.page.height - M - 24) {
        this.page();
        draw(header, 'bold', BAND);
      }
      draw(cells, 'text');
    }
    this.y += 8;
  }

  /** Key–value lines in two columns (the title block). */
  block(pairs: [string, string][]) {
    const keyW = 110;
    const top = this.y;
    this.doc.lineWidth(1).strokeColor(INK);
    for (const [k, v] of pairs) {
      this.doc.font('text').fontSize(9.5);
      const h = Math.max(14, this.doc.heightOfString(v, { width: this.width - keyW - 12 }) + 5);
      this.doc.font('bold').fontSize(8.5).fillColor(MUTED).text(k.toUpperCase(), M + 6, this.y + 4, { width: keyW - 6 });
      this.doc.font(k === 'Input hash' ? 'mono' : 'text').fontSize(k === 'Input hash' ? 8 : 9.5).fillColor(INK).text(v, M + keyW, this.y + 3, { width: this.width - keyW - 12 });
      this.y += h;
    }
    this.doc.rect(M, top, this.width, this.y - top + 3).stroke();
    this.y += 14;
  }

  /** An SVG figure within the text column, scaled to the column's width (at most its own size). */
  figure(svg: string, width: number, height: number) {
    const scale = Math.min(1, this.width / width);
    this.room(height * scale + 8);
    // assumePt: the figure's units are points, as reserved here (svg-to-pdfkit otherwise reads them as CSS px).
    SVGtoPDF(this.doc, svg, M, this.y, { width: width * scale, height: height * scale, fontCallback: pickFont, assumePt: true });
    this.y += height * scale + 8;
  }

  drawing(svg: string, width: number, height: number) {
    this.page('landscape');
    const w = this.doc.page.width - 2 * M;
    const h = this.doc.page.height - 2 * M - 40;
    const scale = Math.min(w / width, h / height);
    this.doc.font('bold').fontSize(12).fillColor(INK).text('Drawing (base case)', M, M);
    SVGtoPDF(this.doc, svg, M, M + 22, {
      width: width * scale,
      height: height * scale,
      preserveAspectRatio: 'xMidYMid meet',
      fontCallback: pickFont,
    });
    this.page();
  }

  finish(): Promise<Uint8Array> {
    const range = this.doc.bufferedPageRange();
    for (let i = range.start; i < range.start + range.count; i++) {
      this.doc.switchToPage(i);
      const bottom = this.doc.page.height - M + 10;
      // Writing below the bottom margin would start a new page: lift it for the footer.
      const saved = this.doc.page.margins.bottom;
      this.doc.page.margins.bottom = 0;
      this.doc.font('text').fontSize(6.5).fillColor(MUTED);
      this.doc.text(`${this.footer}   ·   page ${i + 1} of ${range.count}`, M, bottom, { width: this.doc.page.width - 2 * M, lineBreak: false });
      this.doc.text('Engineering estimate from the data entered: not a substitute for measurement, the local code, the utility or a licensed professional.', M, bottom + 9, { width: this.doc.page.width - 2 * M, lineBreak: false });
      this.doc.page.margins.bottom = saved;
    }
    return new Promise((resolve, reject) => {
      const chunks: Buffer[] = [];
      this.doc.on('data', (c: Buffer) => chunks.push(c));
      this.doc.on('end', () => resolve(new Uint8Array(Buffer.concat(chunks))));
      this.doc.on('error', reject);
      this.doc.end();
    });
  }
}

function busRows(r: SolveResult) {
  return r.buses.map((b) => [
    b.name,
    b.state,
    v1(b.lineToNeutralVolts.A),
    v1(b.lineToNeutralVolts.B),
    v1(b.lineToNeutralVolts.C),
    v1(b.lineToLineVolts.AB ?? b.lineToLineVolts.CA ?? b.lineToLineVolts.BC),
    v1(b.neutralToGroundVolts, 2),
    b.unbalance ? v1(b.unbalance.nemaPercent, 2) : '—',
  ]);
}
const BUS_COLUMNS: Column[] = [
  { title: 'Bus', width: 26 },
  { title: 'State', width: 14 },
  { title: 'A–N V', width: 9, align: 'right' },
  { title: 'B–N V', width: 9, align: 'right' },
  { title: 'C–N V', width: 9, align: 'right' },
  { title: 'L–L V', width: 9, align: 'right' },
  { title: 'N–G V', width: 9, align: 'right' },
  { title: 'Unbal. %', width: 9, align: 'right' },
];

function loadRows(r: SolveResult) {
  return r.loads.flatMap((l) =>
    l.elements.map((e) => [
      l.name,
      e.label,
      v1(e.volts),
      v1(e.percentOfRating),
      e.standing?.standing ?? '—',
      v1(e.amperes),
      `${MODEL_SHORT[e.model] ?? e.model}${e.switchedToImpedance ? ', switched' : ''}`,
      e.constantImpedanceVolts !== undefined ? v1(e.constantImpedanceVolts) : '—',
    ]),
  );
}
/** Short names for the load models in narrow columns; the data section spells them out. */
const MODEL_SHORT: Record<string, string> = { 'constant-impedance': 'const. Z', 'constant-current': 'const. I', 'constant-power': 'const. P', mix: 'mix' };

const LOAD_COLUMNS: Column[] = [
  { title: 'Load', width: 28 },
  { title: 'Element', width: 9 },
  { title: 'V', width: 8, align: 'right' },
  { title: '% rating', width: 9, align: 'right' },
  { title: 'Standing', width: 11 },
  { title: 'A', width: 8, align: 'right' },
  { title: 'Model', width: 15 },
  { title: 'V if all Z', width: 10, align: 'right' },
];

function runRows(r: SolveResult) {
  return r.runs.map((run) => {
    const c = run.conductors;
    const amps = (k: keyof typeof c) => (c[k] ? `${v1(c[k]!.current.magnitude)}${c[k]!.open ? ' open' : ''}` : '—');
    const worst = Math.max(...Object.values(c).map((k) => k?.percentOfAmpacity ?? 0));
    return [run.name, amps('A'), amps('B'), amps('C'), amps('N'), worst > 0 ? v1(worst) : '—', v1(run.voltageDropPercent, 2)];
  });
}
const RUN_COLUMNS: Column[] = [
  { title: 'Run', width: 30 },
  { title: 'A (A)', width: 10, align: 'right' },
  { title: 'B (A)', width: 10, align: 'right' },
  { title: 'C (A)', width: 10, align: 'right' },
  { title: 'N (A)', width: 10, align: 'right' },
  { title: 'Max % ampacity', width: 13, align: 'right' },
  { title: 'Drop %', width: 10, align: 'right' },
];

function studyTable(rep: Report, t: StudyTable) {
  const scale = t.figure ? Math.min(1, rep.width / t.figure.width) : 0;
  rep.heading(t.title, 2, t.figure ? t.figure.height * scale + 8 : 40);
  if (t.figure) rep.figure(t.figure.svg, t.figure.width, t.figure.height);
  if (t.columns.length > 0) rep.table(t.columns.map((c, i) => ({ title: c, width: t.widths?.[i] ?? 100 / t.columns.length, align: t.align?.[i] })), t.rows);
  if (t.notes) rep.bullets(t.notes);
}

/** The base case and every what-if in one line each: where the loads stand at the extremes. */
function caseTable(rep: Report, results: ReportInput['results']) {
  const fmtLoad = (l?: { name: string; percentOfRating: number; volts: number }) => (l ? `${v1(l.percentOfRating)} % (${v1(l.volts)} V) ${l.name}` : '—');
  rep.table(
    [
      { title: 'Case', width: 30 },
      { title: 'Highest load', width: 26 },
      { title: 'Lowest load', width: 26 },
      { title: 'Source kW / fault kA', width: 14, align: 'right' },
    ],
    [results.base, ...results.whatIfs].map((c) => {
      const s = caseSummary(c);
      if (!s.ok) return [s.name, `not solved: ${s.error}`, '', ''];
      return [s.name, fmtLoad(s.highestLoad), fmtLoad(s.lowestLoad), s.faultKa !== undefined ? `${v1(s.faultKa, 2)} kA` : v1(s.sourceKw, 2)];
    }),
  );
}

export async function renderReportPdf(input: ReportInput): Promise<Uint8Array> {
  const { revision, results } = input;
  const footer = `${input.projectName} · ${input.sheetName} · revision ${revision.number} · ${revision.inputHash.slice(0, 12)}`;
  const read = readSheet(input.document);
  // Paper follows the sheet's practice: A4 where the sheet works to IEC 60038, US Letter otherwise.
  const rep = new Report(footer, read.ok && read.sheet.settings.voltageStandard === 'iec-60038' ? 'A4' : 'LETTER');
  const sheet: Sheet | null = read.ok ? read.sheet : null;
  const base = results.base.ok ? (results.base.result ?? null) : null;

  // Title block.
  rep.doc.font('bold').fontSize(20).fillColor(INK).text('Study report', M, M);
  rep.doc.font('text').fontSize(10).fillColor(MUTED).text('Phasewright', M, rep.doc.y);
  rep.y = rep.doc.y + 12;
  rep.block([
    ['Project', input.projectName],
    ['Sheet', input.sheetName],
    ['Revision', `${revision.number} (${revision.status})${revision.note ? ` — ${revision.note}` : ''}`],
    ['Date issued', dateOf(revision.issuedAt)],
    ['Author', revision.issuedBy.name || '—'],
    ['Reviews', revision.reviews.length ? revision.reviews.map((r) => `${r.verdict} by ${r.reviewer.name}${r.reviewer.viaLink ? ' (viewer link)' : ''}, ${dateOf(r.createdAt)}${r.comment ? `: “${r.comment}”` : ''}`).join('\n') : 'none yet'],
    ['Solver version', revision.solverVersion],
    ['Input hash', `SHA-256 ${revision.inputHash}`],
    ['Report made', dateOf(input.generatedAt)],
  ]);
  rep.heading('Cautions');
  rep.para(CAUTION);
  rep.para('Local codes, the utility’s requirements and licensed practice govern; where they differ from anything in this report, they apply.', { color: MUTED, size: 9 });
  rep.heading('Summary of the cases');
  rep.para('Load voltages as a percent of each load’s rating, at the extremes, for the base case and each what-if.', { color: MUTED, size: 9 });
  caseTable(rep, results);
  if (results.invalid) {
    rep.heading('The sheet could not be read');
    rep.bullets(results.invalid.issues.map((i) => `${i.path || '(document)'}: ${i.message}`));
  }

  // Drawing.
  const d = drawingSvg(input.document, { base, title: input.sheetName });
  rep.drawing(d.svg, d.width, d.height);

  // Base case.
  rep.heading('Base case');
  if (!base) rep.para(`Not solved: ${results.base.error?.message ?? 'unknown reason'}`);
  else {
    const pb = base.powerBalance;
    rep.para(`Standard: ${base.standard.label}. ${base.frequencyHz} Hz. Source ${v1(pb.sourceKw, 2)} kW, ${v1(pb.sourceKvar, 2)} kvar; loads ${v1(pb.loadKw, 2)} kW; losses ${v1(pb.lossKw, 3)} kW. Power balance mismatch ${pb.mismatchPercent.toExponential(1)} %, KCL residual ${base.kclResidual.toExponential(1)}.`);
    rep.heading('Bus voltages', 2);
    rep.table(BUS_COLUMNS, busRows(base));
    rep.heading('Load voltages', 2);
    rep.table(LOAD_COLUMNS, loadRows(base));
    rep.heading('Conductor currents', 2);
    rep.table(RUN_COLUMNS, runRows(base));
    if (base.warnings.length > 0) {
      rep.heading('Warnings', 2);
      rep.bullets(base.warnings.map((w) => w.message));
    }
  }

  // What-ifs.
  rep.heading('What-ifs');
  if (results.whatIfs.length === 0) rep.para('This sheet has no what-ifs.');
  else {
    rep.para('Each what-if is summarised on the first page; here are its bus voltages and the loads farthest from their rating.', { color: MUTED, size: 9 });
    for (const w of results.whatIfs) {
      rep.heading(`What-if: ${w.name}`, 2);
      if (!w.ok || !w.result) {
        rep.para(`Not solved: ${w.error?.message ?? 'unknown reason'}`);
        continue;
      }
      if (w.result.fault) rep.para(`Fault at ${w.result.fault.busId}: ${v1(w.result.fault.symmetricalKa, 2)} kA symmetrical, ${v1(w.result.fault.peakKa, 2)} kA peak, X/R ${v1(w.result.fault.xOverR, 2)}.`);
      rep.table(BUS_COLUMNS, busRows(w.result));
      const worst = loadRows(w.result)
        .filter((r) => r[3] !== '—')
        .sort((a, b) => Math.abs(Number(b[3]) - 100) - Math.abs(Number(a[3]) - 100))
        .slice(0, 8);
      if (worst.length > 0) {
        rep.para('Loads farthest from their rating:', { size: 8.5, color: MUTED, keep: 60 });
        rep.table(LOAD_COLUMNS, worst);
      }
    }
  }

  // Fault study.
  rep.heading('Fault study');
  const fs = results.faultStudy;
  if (!fs) rep.para('Not run: the sheet has no bus.');
  else if (!fs.ok) rep.para(`Not run: ${fs.error.message}`);
  else {
    const busName = (id: string) => (sheet?.elements[id]?.name || id);
    rep.heading('Fault currents at each bus', 2);
    rep.table(
      [
        { title: 'Bus', width: 22 },
        { title: 'Fault', width: 20 },
        { title: 'Sym. kA', width: 9, align: 'right' },
        { title: 'Peak kA', width: 9, align: 'right' },
        { title: 'X/R', width: 8, align: 'right' },
        { title: 'Note', width: 32 },
      ],
      fs.study.cases.map((c) => [busName(c.busId), c.faultType, v1(c.symmetricalKa, 2), v1(c.peakKa, 2), v1(c.xOverR, 2), c.problem ?? '']),
    );
    rep.heading('Interrupting ratings', 2);
    if (fs.study.duties.length === 0) rep.para('No breaker or bus has an interrupting rating to check.');
    else
      rep.table(
        [
          { title: 'Equipment', width: 26 },
          { title: 'At bus', width: 20 },
          { title: 'Rating kA', width: 11, align: 'right' },
          { title: 'Duty kA', width: 11, align: 'right' },
          { title: 'Adjusted kA', width: 12, align: 'right' },
          { title: 'Result', width: 14 },
          { title: 'Margin %', width: 10, align: 'right' },
        ],
        fs.study.duties.map((dc) => [busName(dc.elementId), busName(dc.locationBusId), v1(dc.interruptingKa, 1), v1(dc.dutyKa, 2), v1(dc.adjustedDutyKa, 2), dc.status.replace(/-/g, ' '), v1(dc.marginPercent, 0)]),
      );
    if (fs.study.serviceMarkings.length > 0) {
      rep.heading('Available fault current for the service marking (NEC 110.24)', 2);
      rep.table(
        [
          { title: 'Service', width: 40 },
          { title: 'Available kA', width: 20, align: 'right' },
          { title: 'Fault', width: 25 },
          { title: 'X/R', width: 15, align: 'right' },
        ],
        fs.study.serviceMarkings.map((m) => [busName(m.busId), v1(m.availableFaultKa, 2), m.faultType, v1(m.xOverR, 2)]),
      );
    }
  }

  // Further studies: those registered in this build, and the planned ones named as not run.
  for (const planned of PLANNED_STUDIES) {
    const got = results.extra.find((e) => e.id === planned.id);
    // Keep the heading with a figure that opens the study.
    const first = got?.ok ? got.tables[0]?.figure : undefined;
    rep.heading(planned.title, 1, first ? first.height * Math.min(1, rep.width / first.width) + 40 : 40);
    if (!got) rep.para('Not run in this build of Phasewright.', { color: MUTED });
    else if (!got.ok) rep.para(`Could not be run: ${got.error}`);
    else
      for (const t of got.tables) studyTable(rep, t);
  }
  for (const extra of results.extra.filter((e) => !PLANNED_STUDIES.some((p) => p.id === e.id))) {
    rep.heading(extra.title);
    if (!extra.ok) rep.para(`Could not be run: ${extra.error}`);
    for (const t of extra.tables) studyTable(rep, t);
  }

  // Panel schedules.
  rep.heading('Panel schedules');
  const schedules = sheet ? panelSchedules(sheet, base ?? undefined) : [];
  if (schedules.length === 0) rep.para('No panel on this sheet feeds a load.');
  for (const p of schedules) {
    rep.heading(p.name, 2);
    rep.table(
      [
        { title: 'Circuit', width: 10 },
        { title: 'Description', width: 32 },
        { title: 'Phases', width: 9 },
        { title: 'Load', width: 10, align: 'right' },
        { title: 'PF', width: 8, align: 'right' },
        { title: 'Load behaviour', width: 18 },
        { title: 'Breaker', width: 13 },
      ],
      p.rows.map((r) => [r.circuit, r.description, r.phases, r.load, r.powerFactor, r.behaviour, r.breaker]),
    );
  }

  // Data and assumptions.
  rep.heading('Data and assumptions');
  if (sheet) {
    const st = sheet.settings;
    rep.heading('Standards and settings', 2);
    rep.bullets([
      `Voltage standard: ${base?.standard.label ?? st.voltageStandard}.`,
      `Frequency ${st.frequencyHz} Hz; earth resistivity ${st.earthResistivityOhmM} Ω·m (Carson's equations for overhead runs).`,
      `Low-voltage switch: below ${Math.round(st.lowVoltageSwitchFraction * 100)} % of its rated voltage, a constant-current or constant-power load is taken as constant impedance.`,
      `Load iteration tolerance ${st.loadMismatchTolerance} of rated current, at most ${st.maxLoadIterations} iterations.`,
      'Conductor impedances from NEC Chapter 9 Table 9 (or Table 8 / IEC 60228 where the run says so); ampacity from NEC 310.16 with the usual adjustments, the neutral counted where it carries unbalance.',
    ]);
    const kinds = new Map<string, number>();
    for (const l of base?.loads ?? []) kinds.set(`${l.loadKind}: ${l.model.replace(/-/g, ' ')}`, (kinds.get(`${l.loadKind}: ${l.model.replace(/-/g, ' ')}`) ?? 0) + 1);
    if (kinds.size > 0) {
      rep.heading('Load behaviour used', 2);
      rep.bullets([...kinds].map(([k, count]) => `${k} (${count} load${count === 1 ? '' : 's'})`));
    }
  }
  const assumptions = new Set<string>([...(base?.assumptions ?? []), ...(fs && fs.ok ? fs.study.assumptions : [])]);
  if (assumptions.size > 0) {
    rep.heading('Assumptions of the solve', 2);
    rep.bullets([...assumptions]);
  }
  rep.bullets(['Load models in the tables: const. Z = constant impedance, const. I = constant current, const. P = constant power, mix = a share of each; "switched" = turned to constant impedance by the low-voltage switch. "V if all Z" = the voltage with every load at constant impedance, shown under an open or degraded neutral.']);
  rep.heading('Cautions');
  rep.para(CAUTION);
  return rep.finish();
}

export { SVG_FONTS };
