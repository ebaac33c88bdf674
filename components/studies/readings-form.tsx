// The readings match: the voltages measured in the field, added by tapping a load or bus on the drawing and then
// "Add a reading here" (then the two bars, or the load's element, the meter was across), or pasted as CSV lines; then the ranked candidate causes in their groups (the readings
// cannot tell a group's members apart), how well the best fits and how sure the ranking is. The best is shown on
// the drawing when the match answers; a tap shows another.
import { useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import type { WhatIfChange } from '@/shared/sheet';
import type { CsvProblem, ReadingRow } from '@/editor/studies/readings-entry';
import type { MatchSection } from '@/editor/studies/studies-view';
import { radius, space, touchTargetMin } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { Button, IconButton } from '../ui/button';
import { Icon } from '../ui/icon';
import { Text } from '../ui/text';
import { TextField } from '../ui/text-field';
import { AcrossChooser } from './across-chooser';
import { StandingBadge } from './standing-badge';

export interface ReadingsFormProps {
  /** Cards stack the bars under each reading (a phone); a table puts them beside it. */
  layout: 'cards' | 'table';
  readings: ReadingRow[];
  selected: { id: string; name: string } | null;
  match: MatchSection;
  /** The new entry's id: its bars open for choosing. */
  onAddAt: (elementId: string) => string | null;
  onAcross: (id: string, key: string) => void;
  onVolts: (id: string, text: string) => void;
  onRemove: (id: string) => void;
  onPaste: (text: string) => CsvProblem[];
  onRun: () => string[];
  onShowCandidate: (changes: Record<string, WhatIfChange>, description: string) => void;
}

const VERDICT: Record<string, { words: string; standing: 'normal' | 'tolerable' | 'outside' }> = {
  clear: { words: 'Clear: the best stands apart', standing: 'normal' },
  likely: { words: 'Likely, not certain', standing: 'tolerable' },
  ambiguous: { words: 'Ambiguous: the next group fits as well', standing: 'tolerable' },
  'poor-fit': { words: 'Poor fit: no candidate explains the readings', standing: 'outside' },
};

export function ReadingsForm(p: ReadingsFormProps) {
  const { color } = useTheme();
  const [csv, setCsv] = useState('');
  const [csvProblems, setCsvProblems] = useState<CsvProblem[]>([]);
  const [runProblems, setRunProblems] = useState<string[]>([]);
  // The one reading whose bars are open for choosing (the newest, until another is opened).
  const [openId, setOpenId] = useState<string | null>(null);
  const r = p.match.result;
  return (
    <View style={styles.gap} testID="readings-form">
      <Text variant="small" tone="muted">
        Tap a load or a bus on the drawing, add a reading there and choose what the meter was across; or paste lines of “where, volts[, across]”.
      </Text>
      <Button
        label={p.selected ? `Add a reading at ${p.selected.name}` : 'Tap a load or bus on the drawing first'}
        icon="plus"
        variant="secondary"
        disabled={!p.selected}
        onPress={() => {
          const id = p.selected ? p.onAddAt(p.selected.id) : null;
          if (id) setOpenId(id);
        }}
        testID="reading-add"
      />
      {p.readings.map((row) => (
        <ReadingItem key={row.entry.id} row={row} wide={p.layout === 'table'} open={openId === row.entry.id} onOpen={(on) => setOpenId(on ? row.entry.id : null)} onVolts={p.onVolts} onRemove={p.onRemove} onAcross={p.onAcross} />
      ))}
      <TextField
        label="Or paste CSV"
        value={csv}
        onChangeText={setCsv}
        multiline
        placeholder={'Apartment 4 lights, 186\nService, 118.5, A-N'}
        testID="readings-csv"
        autoCapitalize="none"
      />
      <Button
        label="Use the pasted readings"
        variant="secondary"
        compact
        disabled={!csv.trim()}
        onPress={() => {
          const problems = p.onPaste(csv);
          setCsvProblems(problems);
          if (problems.length === 0) setCsv('');
        }}
        testID="readings-csv-use"
      />
      {csvProblems.length ? (
        <View style={[styles.alert, { borderColor: color.danger, backgroundColor: color.dangerSoft }]} role="alert" testID="readings-csv-problems">
          <Text variant="label">Nothing was taken from the paste:</Text>
          {csvProblems.map((q, i) => (
            <Text key={i} variant="small">
              Line {q.line}: {q.message}
            </Text>
          ))}
        </View>
      ) : null}
      {runProblems.length ? (
        <View style={[styles.alert, { borderColor: color.danger, backgroundColor: color.dangerSoft }]} role="alert" testID="readings-problems">
          {runProblems.map((q, i) => (
            <Text key={i} variant="small">
              {q}
            </Text>
          ))}
        </View>
      ) : null}
      {p.match.running ? null : <Button label="Match the readings" icon="search" onPress={() => setRunProblems(p.onRun())} testID="match-run" />}
      {p.match.error ? (
        <Text variant="small" tone="danger" testID="match-error">
          The readings match could not run: {p.match.error}
        </Text>
      ) : null}
      {p.match.stale && r ? (
        <Text variant="small" tone="muted" testID="match-stale">
          The sheet changed since this match ran: run it again for current figures.
        </Text>
      ) : null}
      {r ? (
        <View style={styles.gap} testID="match-result">
          <View style={styles.row}>
            <StandingBadge standing={VERDICT[r.certainty.verdict]?.standing ?? 'plain'} label={VERDICT[r.certainty.verdict]?.words ?? r.certainty.verdict} />
          </View>
          <Text variant="small" testID="match-fit">
            Best fit: {r.fit.rmsVolts.toFixed(2)} V RMS ({r.fit.rmsPercent.toFixed(2)} %), {r.fit.withinTolerance ? 'every reading within the tolerance' : 'not every reading within the tolerance'}; next group{' '}
            {Number.isFinite(r.certainty.ratio) ? `${r.certainty.ratio.toFixed(1)} × worse (${r.certainty.gapVolts.toFixed(2)} V)` : 'none'}.
          </Text>
          {r.groups.slice(0, 12).map((g, gi) => (
            <View key={gi} style={[styles.group, { borderColor: gi === 0 ? color.primary : color.line }]} testID={`match-group-${gi}`}>
              <Text variant="caption" tone="muted">
                {gi + 1}. {g.candidates.length > 1 ? `${g.candidates.length} candidates the readings cannot tell apart` : 'One candidate'} · {g.rmsVolts.toFixed(2)} V RMS
              </Text>
              {g.candidates.slice(0, 6).map((c, ci) => {
                const on = c.description === p.match.shownDescription;
                return (
                  <Pressable
                    key={ci}
                    onPress={() => p.onShowCandidate(c.changes, c.description)}
                    accessibilityRole="button"
                    accessibilityState={{ selected: on }}
                    accessibilityLabel={`${c.description}: ${c.rmsVolts.toFixed(2)} V RMS. Show on the drawing`}
                    testID={`match-candidate-${gi}-${ci}`}
                    style={({ pressed }) => [styles.candidate, { backgroundColor: on || pressed ? color.raised : 'transparent' }]}
                  >
                    <Text variant="small" style={styles.flex}>
                      {c.description}
                    </Text>
                    <Text variant="caption" tone="muted">
                      load × {c.loadLevel.factor.toFixed(2)}
                    </Text>
                  </Pressable>
                );
              })}
            </View>
          ))}
        </View>
      ) : null}
    </View>
  );
}

interface ReadingItemProps {
  row: ReadingRow;
  wide: boolean;
  open: boolean;
  onOpen: (open: boolean) => void;
  onVolts: (id: string, text: string) => void;
  onRemove: (id: string) => void;
  onAcross: (id: string, key: string) => void;
}

function ReadingItem({ row, wide, open, onOpen, onVolts, onRemove, onAcross }: ReadingItemProps) {
  const { color } = useTheme();
  const { entry, at, across, chosen, problem } = row;
  const chosenLabel = across.flatMap((g) => g.choices).find((c) => c.key === chosen)?.label ?? '—';
  const what = entry.point.kind === 'bus' ? 'bars' : 'element';
  const chooser = across.length ? (
    <View style={styles.gap}>
      <Pressable
        onPress={() => onOpen(!open)}
        role="button"
        aria-expanded={open}
        aria-label={`${open ? 'Close' : 'Change'} the ${what} of the reading at ${entry.where}`}
        testID={`reading-across-toggle-${entry.id}`}
        style={({ pressed }) => [styles.toggle, { borderColor: color.line, backgroundColor: pressed ? color.raised : 'transparent' }]}
      >
        <Text variant="small" tone="muted">
          Across
        </Text>
        <Text variant="label">{chosenLabel}</Text>
        <Icon name={open ? 'chevron-up' : 'chevron-down'} size={16} color={color.inkMuted} />
      </Pressable>
      {open ? <AcrossChooser groups={across} chosen={chosen} at={at} onChoose={(key) => onAcross(entry.id, key)} testID={`reading-across-${entry.id}`} /> : null}
    </View>
  ) : null;
  return (
    <View style={[styles.reading, { borderColor: open ? color.primary : color.line }]} testID={`reading-${entry.id}`}>
      <View style={[styles.readingTop, wide && styles.readingWide]}>
        <View style={[styles.flex, styles.gapXs]}>
          <Text variant="small" numberOfLines={2} testID={`reading-where-${entry.id}`}>
            {entry.where}
          </Text>
          {problem ? (
            <Text variant="small" tone="danger" role="alert" testID={`reading-problem-${entry.id}`}>
              {problem}
            </Text>
          ) : null}
          {wide ? chooser : null}
        </View>
        <View style={styles.volts}>
          <TextField label="Volts" value={entry.voltsText} onChangeText={(t) => onVolts(entry.id, t)} keyboardType="decimal-pad" placeholder="e.g. 121.4" testID={`reading-volts-${entry.id}`} />
        </View>
        <IconButton icon="x" label={`Remove the reading at ${entry.where}`} onPress={() => onRemove(entry.id)} testID={`reading-remove-${entry.id}`} />
      </View>
      {wide ? null : chooser}
    </View>
  );
}

const styles = StyleSheet.create({
  flex: { flex: 1 },
  gap: { gap: space.sm },
  row: { flexDirection: 'row' },
  gapXs: { gap: space.xs },
  reading: { borderWidth: 1, borderRadius: radius.md, padding: space.sm, gap: space.sm },
  readingTop: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  readingWide: { alignItems: 'flex-start' },
  toggle: { flexDirection: 'row', alignItems: 'center', alignSelf: 'flex-start', gap: space.xs, minHeight: touchTargetMin, borderWidth: 1, borderRadius: radius.md, paddingHorizontal: space.sm },
  volts: { width: 110 },
  alert: { borderWidth: 1, borderRadius: radius.md, padding: space.md, gap: space.xs },
  group: { borderWidth: 1, borderRadius: radius.md, padding: space.sm, gap: space.xs },
  candidate: { flexDirection: 'row', alignItems: 'center', gap: space.sm, minHeight: touchTargetMin, borderRadius: radius.sm, paddingHorizontal: space.xs },
});
