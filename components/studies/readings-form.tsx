// The readings match: the voltages measured in the field, added by tapping a load or bus on the drawing and then
// "Add a reading here", or pasted as CSV lines; then the ranked candidate causes in their groups (the readings
// cannot tell a group's members apart), how well the best fits and how sure the ranking is. The best is shown on
// the drawing when the match answers; a tap shows another.
import { useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import type { WhatIfChange } from '@/shared/sheet';
import type { CsvProblem, ReadingEntry } from '@/editor/studies/readings-entry';
import type { MatchSection } from '@/editor/studies/studies-view';
import { radius, space, touchTargetMin } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { Button, IconButton } from '../ui/button';
import { Text } from '../ui/text';
import { TextField } from '../ui/text-field';
import { StandingBadge } from './standing-badge';

export interface ReadingsFormProps {
  readings: ReadingEntry[];
  selected: { id: string; name: string } | null;
  match: MatchSection;
  onAddAt: (elementId: string) => void;
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
  const r = p.match.result;
  return (
    <View style={styles.gap} testID="readings-form">
      <Text variant="small" tone="muted">
        Tap a load or a bus on the drawing, then add a reading there; or paste lines of “where, volts[, across]”.
      </Text>
      <Button
        label={p.selected ? `Add a reading at ${p.selected.name}` : 'Tap a load or bus on the drawing first'}
        icon="plus"
        variant="secondary"
        disabled={!p.selected}
        onPress={() => p.selected && p.onAddAt(p.selected.id)}
        testID="reading-add"
      />
      {p.readings.map((e) => (
        <View key={e.id} style={styles.reading} testID={`reading-${e.id}`}>
          <Text variant="small" style={styles.flex} numberOfLines={2}>
            {e.where}
          </Text>
          <View style={styles.volts}>
            <TextField label="Volts" value={e.voltsText} onChangeText={(t) => p.onVolts(e.id, t)} keyboardType="decimal-pad" placeholder="e.g. 121.4" testID={`reading-volts-${e.id}`} />
          </View>
          <IconButton icon="x" label={`Remove the reading at ${e.where}`} onPress={() => p.onRemove(e.id)} />
        </View>
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

const styles = StyleSheet.create({
  flex: { flex: 1 },
  gap: { gap: space.sm },
  row: { flexDirection: 'row' },
  reading: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  volts: { width: 110 },
  alert: { borderWidth: 1, borderRadius: radius.md, padding: space.md, gap: space.xs },
  group: { borderWidth: 1, borderRadius: radius.md, padding: space.sm, gap: space.xs },
  candidate: { flexDirection: 'row', alignItems: 'center', gap: space.sm, minHeight: touchTargetMin, borderRadius: radius.sm, paddingHorizontal: space.xs },
});
