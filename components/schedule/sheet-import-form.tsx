// Importing a whole sheet from our JSON format into the open sheet: choose a file or paste, see what it holds (or
// every problem with its path), and confirm before it replaces the drawing. One undo takes the import back.
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import type { Sheet } from '@/shared/sheet';
import type { SheetImportResult } from '@/editor/import/sheet-import';
import { radius, space } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { Button } from '../ui/button';
import { ConfirmDialog } from '../ui/confirm-dialog';
import { FormMessage } from '../ui/states';
import { Text } from '../ui/text';
import { TextSource } from './text-source';

export interface SheetImportFormProps {
  sheetName: string;
  maxBytes: number;
  onRead: (text: string) => SheetImportResult;
  onReplace: (sheet: Sheet) => void;
  onDone: (message: string) => void;
  onCancel: () => void;
}

export function SheetImportForm(p: SheetImportFormProps) {
  const { color } = useTheme();
  const [text, setText] = useState('');
  const [source, setSource] = useState<string | null>(null);
  const [result, setResult] = useState<SheetImportResult | null>(null);
  const [fileError, setFileError] = useState<string | null>(null);
  const [confirming, setConfirming] = useState(false);


  return (
    <View style={styles.root} testID="sheet-import">
      <Text variant="small" tone="muted">
        A sheet in Phasewright’s JSON format (any version this build knows: older ones are brought up to date). It replaces what is drawn on “{p.sheetName}”; one undo takes it back.
      </Text>
      <TextSource
        format="JSON"
        accept=".json,application/json"
        maxBytes={p.maxBytes}
        lines={6}
        text={text}
        source={source}
        onText={(t, from) => {
          setText(t);
          setSource(from);
          setFileError(null);
          // A chosen file is checked at once; typed text when asked.
          setResult(from ? p.onRead(t) : null);
        }}
        onTooLarge={(name) => {
          setResult(null);
          setFileError(`${name} is too large: at most ${Math.round(p.maxBytes / 1024 / 1024)} MB. Nothing was changed.`);
        }}
        testIDs={{ pick: 'sheet-import-pick', text: 'sheet-import-text' }}
      />
      <View style={styles.buttons}>
        <Button label="Check the sheet" variant="secondary" compact onPress={() => setResult(p.onRead(text))} testID="sheet-import-check" />
      </View>
      <FormMessage message={fileError} />
      {result && !result.ok ? (
        <View style={[styles.box, { borderColor: color.danger }]} role="alert" testID="sheet-import-issues">
          <Text tone="danger" variant="bodyStrong">
            {result.issues.length} problem{result.issues.length === 1 ? '' : 's'}: nothing was changed.
          </Text>
          {result.issues.slice(0, 50).map((i, k) => (
            <Text key={`${i.path}-${k}`} variant="small" tone="danger">
              <Text variant="number" tone="danger">
                {i.path || '(the document)'}
              </Text>
              {`: ${i.message}`}
            </Text>
          ))}
          {result.issues.length > 50 ? <Text variant="small">and {result.issues.length - 50} more</Text> : null}
        </View>
      ) : null}
      {result?.ok ? (
        <View style={[styles.box, { borderColor: color.line }]} testID="sheet-import-summary">
          <Text variant="bodyStrong">{result.summary.name || 'Unnamed sheet'}</Text>
          <Text variant="small">
            {result.summary.elements} elements, {result.summary.connections} connections, {result.summary.whatIfs} what-ifs
            {result.migratedFrom !== undefined ? ` · brought up from format version ${result.migratedFrom}` : ''}
          </Text>
          {result.warnings.slice(0, 10).map((w, k) => (
            <Text key={k} variant="small" tone="muted">
              {w.path}: {w.message}
            </Text>
          ))}
        </View>
      ) : null}
      <View style={styles.buttons}>
        <Button label="Cancel" variant="secondary" compact onPress={p.onCancel} testID="sheet-import-cancel" />
        <Button label="Replace the sheet…" variant="danger" compact disabled={!result?.ok} onPress={() => setConfirming(true)} testID="sheet-import-replace" />
      </View>
      <ConfirmDialog
        visible={confirming && !!result?.ok}
        title="Replace the drawing?"
        message={`Everything drawn on “${p.sheetName}” is replaced by the drawing of “${result?.ok ? result.summary.name || 'the imported sheet' : ''}” for everyone on the sheet; the sheet keeps its name. Undo takes it back.`}
        confirmLabel="Replace"
        danger
        onCancel={() => setConfirming(false)}
        onConfirm={() => {
          if (!result?.ok) return;
          setConfirming(false);
          p.onReplace(result.sheet);
          p.onDone(`Imported “${result.summary.name || 'sheet'}”: one undo takes it back`);
        }}
        testID="sheet-import-confirm"
      />
    </View>
  );
}

const styles = StyleSheet.create({
  root: { gap: space.md },
  buttons: { flexDirection: 'row', gap: space.sm, flexWrap: 'wrap', justifyContent: 'flex-end' },
  box: { borderWidth: 1, borderRadius: radius.md, padding: space.md, gap: space.xxs },
});
