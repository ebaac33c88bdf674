// Importing a panel schedule from CSV into one panel: choose a file or paste the text, see every row as read with
// its problems (line and reason), and only when every row is good, place the circuits. Nothing changes before that.
import { useState } from 'react';
import { ScrollView, StyleSheet, View } from 'react-native';
import { CSV_COLUMNS, REQUIRED_COLUMNS, type CsvReadResult, type ImportedCircuit } from '@/editor/schedule/schedule-csv';
import { radius, space } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { Button } from '../ui/button';
import { FormMessage } from '../ui/states';
import { Text } from '../ui/text';
import { TextSource } from './text-source';

export interface CsvImportFormProps {
  panelName: string;
  /** The largest file accepted, bytes. */
  maxBytes: number;
  onRead: (text: string) => CsvReadResult | null;
  onImport: (circuits: ImportedCircuit[]) => number;
  onDone: (message: string) => void;
  onCancel: () => void;
}

const PREVIEW_COLUMNS = ['circuit', 'description', 'phases', 'load', 'power factor', 'behaviour', 'kind', 'breaker', 'volts'] as const;
const WIDTH: Record<(typeof PREVIEW_COLUMNS)[number], number> = { circuit: 60, description: 160, phases: 56, load: 72, 'power factor': 44, behaviour: 84, kind: 88, breaker: 60, volts: 48 };
const HEADING: Partial<Record<(typeof PREVIEW_COLUMNS)[number], string>> = { 'power factor': 'PF' };

/** How a good row was read: the amount in the load's unit, its wiring and voltage, its breaker. */
function readAs(c: ImportedCircuit): string {
  const amount = c.givenAs === 'kw' ? `${+c.kw.toFixed(3)} kW` : `${c.amperes} A`;
  const wiring = c.connection === 'line-to-neutral' ? `${c.phases[0]}–N` : c.connection === 'line-to-line' ? c.phases.join('–') : c.connection === 'three-phase-wye' ? '3φ wye' : '3φ delta';
  return `✓ ${amount}, ${wiring}, ${c.ratedVolts} V${c.breakerAmperes ? `, ${c.breakerAmperes} A breaker` : ''}`;
}

export function CsvImportForm(p: CsvImportFormProps) {
  const { color } = useTheme();
  const [text, setText] = useState('');
  const [source, setSource] = useState<string | null>(null);
  const [result, setResult] = useState<CsvReadResult | null>(null);
  const [fileError, setFileError] = useState<string | null>(null);

  const check = (t: string) => setResult(p.onRead(t));
  const problems = result && !result.ok ? result.problems : [];
  const fileProblems = result && !result.ok ? result.fileProblems : [];
  const good = result?.ok ? result.circuits : [];

  return (
    <View style={styles.root} testID="csv-import">
      <Text variant="bodyStrong">Import circuits into {p.panelName}</Text>
      <Text variant="small" tone="muted">
        A header row, then one circuit per row. Columns: {CSV_COLUMNS.map((c) => (REQUIRED_COLUMNS.includes(c) ? c : `${c} (optional)`)).join(', ')}. Phases as A, B, C,
        AB, BC, CA, ABC or ABCN; load as kW (or W, kVA, VA, A); behaviour impedance, current, power or by kind.
      </Text>
      <TextSource
        format="CSV"
        accept=".csv,text/csv,text/plain"
        maxBytes={p.maxBytes}
        lines={5}
        text={text}
        source={source}
        onText={(t, from) => {
          setText(t);
          setSource(from);
          setFileError(null);
          // A chosen file is checked at once; typed text when asked.
          if (from) check(t);
          else setResult(null);
        }}
        onTooLarge={(name, sizeBytes) => {
          setResult(null);
          setFileError(`${name} is too large: ${(sizeBytes / 1e6).toFixed(1)} MB, at most ${p.maxBytes / 1e6} MB. Nothing was imported.`);
        }}
        testIDs={{ pick: 'csv-pick', text: 'csv-text' }}
      />
      <View style={styles.buttons}>
        <Button label="Check the rows" variant="secondary" compact onPress={() => check(text)} testID="csv-check" />
      </View>
      <FormMessage message={fileError} testID="csv-file-error" />
      {fileProblems.length ? (
        <View role="alert" testID="csv-file-problems">
          {fileProblems.map((m) => (
            <Text key={m} tone="danger" variant="small">
              {m}
            </Text>
          ))}
          <Text variant="small" tone="muted">
            Nothing was imported.
          </Text>
        </View>
      ) : null}
      {result && result.rows.length ? (
        <ScrollView horizontal testID="csv-preview">
          <View role="table">
            <View role="row" style={[styles.row, { borderBottomColor: color.lineStrong }]}>
              <View style={[styles.cell, { width: 44 }]}>
                <Text variant="caption" tone="muted">
                  LINE
                </Text>
              </View>
              <View style={[styles.cell, { width: 250 }]}>
                <Text variant="caption" tone="muted">
                  READ AS
                </Text>
              </View>
              {PREVIEW_COLUMNS.map((c) => (
                <View key={c} style={[styles.cell, { width: WIDTH[c] }]}>
                  <Text variant="caption" tone="muted">
                    {(HEADING[c] ?? c).toUpperCase()}
                  </Text>
                </View>
              ))}
            </View>
            {result.rows.map((r) => (
              <View key={r.line} role="row" style={[styles.row, { borderBottomColor: color.line, backgroundColor: r.problems.length ? color.dangerSoft : 'transparent' }]} testID={`csv-row-${r.line}`}>
                <View style={[styles.cell, { width: 44 }]}>
                  <Text variant="number">{r.line}</Text>
                </View>
                <View style={[styles.cell, { width: 250 }]}>
                  <Text variant="small" tone={r.problems.length ? 'danger' : 'success'}>
                    {r.problems.length ? r.problems.map((x) => `✕ ${x.column ? `${x.column}: ` : ''}${x.message}`).join('\n') : r.circuit ? readAs(r.circuit) : ''}
                  </Text>
                </View>
                {PREVIEW_COLUMNS.map((c) => (
                  <View key={c} style={[styles.cell, { width: WIDTH[c] }]}>
                    <Text variant="small" tone={r.problems.some((x) => x.column === c) ? 'danger' : 'ink'} numberOfLines={2}>
                      {r.cells[c] ?? ''}
                    </Text>
                  </View>
                ))}
              </View>
            ))}
          </View>
        </ScrollView>
      ) : null}
      {problems.length ? (
        <View style={[styles.problems, { borderColor: color.danger }]} role="alert" testID="csv-problems">
          <Text tone="danger" variant="bodyStrong">
            {problems.length} problem{problems.length === 1 ? '' : 's'} in {new Set(problems.map((x) => x.line)).size} row{new Set(problems.map((x) => x.line)).size === 1 ? '' : 's'}: nothing will be imported until every row is good.
          </Text>
          {problems.map((x, i) => (
            <Text key={`${x.line}-${i}`} variant="small" tone="danger">
              Line {x.line}
              {x.column ? `, ${x.column}` : ''}: {x.message}
            </Text>
          ))}
        </View>
      ) : null}
      {result?.ok && result.ignoredColumns.length ? (
        <Text variant="small" tone="muted">
          Columns not used: {result.ignoredColumns.join(', ')}
        </Text>
      ) : null}
      <View style={styles.buttons}>
        <Button label="Cancel" variant="secondary" compact onPress={p.onCancel} testID="csv-cancel" />
        <Button
          label={good.length ? `Place ${good.length} circuit${good.length === 1 ? '' : 's'} under ${p.panelName}` : 'Place the circuits'}
          compact
          disabled={!result?.ok}
          onPress={() => {
            const n = p.onImport(good);
            setResult(null);
            setText('');
            p.onDone(`Placed ${n} circuit${n === 1 ? '' : 's'} under ${p.panelName}: one undo takes them back`);
          }}
          testID="csv-import-confirm"
        />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  root: { gap: space.md },
  buttons: { flexDirection: 'row', gap: space.sm, flexWrap: 'wrap', justifyContent: 'flex-end' },
  row: { flexDirection: 'row', borderBottomWidth: 1, minHeight: 32 },
  cell: { paddingHorizontal: space.xs, paddingVertical: space.xxs, justifyContent: 'center' },
  problems: { borderWidth: 1, borderRadius: radius.md, padding: space.md, gap: space.xxs },
});
