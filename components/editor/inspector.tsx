// The inspector for the selection: one element's fields (and the phase a load is fed from), a connection's ends
// and conductors, or several elements at once; rotate, duplicate and delete; and the what-if changes that can be
// set for what is selected.
import { StyleSheet, View } from 'react-native';
import type { ConductorId, PhaseId, WhatIfChange } from '@/shared/sheet';
import type { ElementView } from '@/editor/document/sheet-mirror';
import type { FieldDef, Write } from '@/editor/inspector/fields';
import { space } from '../theme/tokens';
import { Button } from '../ui/button';
import { Text } from '../ui/text';
import { ChoiceField } from './choice-field';
import { InspectorForm } from './inspector-form';
import { WhatIfChangeForm, type ChangeTarget } from './what-if-change-form';

export interface LoadFeed {
  connectionId: string;
  busName: string;
  phases: PhaseId[];
  /** The choices: single phases for a line-to-neutral load, pairs for a line-to-line one. */
  options: PhaseId[][];
}

export type InspectorSubject =
  | { kind: 'none' }
  | { kind: 'element'; element: ElementView; readable: ElementView; kindLabel: string; defs: FieldDef[]; feed: LoadFeed | null; invalid: string[] }
  | { kind: 'connection'; id: string; fromName: string; toName: string; pairs: string[]; conductors: ConductorId[] }
  | { kind: 'many'; count: number };

export interface InspectorProps {
  subject: InspectorSubject;
  editable: boolean;
  /** Where a what-if change set here would go; null when none can be set (base case, an editor). */
  changeDestination: string | null;
  onSave: (elementId: string, writes: Write[]) => void;
  onSetPhases: (connectionId: string, loadId: string, phases: PhaseId[]) => void;
  onRotate: () => void;
  onDuplicate: () => void;
  onDelete: () => void;
  onAddChange: (change: WhatIfChange) => void;
  /** Opens a panel's schedule (shown for buses). */
  onOpenSchedule?: (busId: string) => void;
}

function Actions({ editable, onRotate, onDuplicate, onDelete, deleteLabel = 'Delete' }: { editable: boolean; onRotate?: () => void; onDuplicate?: () => void; onDelete: () => void; deleteLabel?: string }) {
  if (!editable) return null;
  return (
    <View style={styles.actions}>
      {onRotate ? <Button label="Rotate" icon="rotate-cw" variant="secondary" compact onPress={onRotate} testID="inspector-rotate" /> : null}
      {onDuplicate ? <Button label="Duplicate" icon="copy" variant="secondary" compact onPress={onDuplicate} testID="inspector-duplicate" /> : null}
      <Button label={deleteLabel} icon="trash-2" variant="secondary" compact onPress={onDelete} testID="inspector-delete" />
    </View>
  );
}

export function Inspector(p: InspectorProps) {
  const s = p.subject;
  if (s.kind === 'none') {
    return (
      <Text tone="muted" testID="inspector-empty">
        {p.editable ? 'Tap an element to see and change its data. Long-press to select several.' : 'Tap an element to see its data and try changes that are never saved.'}
      </Text>
    );
  }
  if (s.kind === 'many') {
    return (
      <View style={styles.box} testID="inspector-many">
        <Text variant="bodyStrong">{s.count} elements selected</Text>
        <Actions editable={p.editable} onRotate={p.onRotate} onDuplicate={p.onDuplicate} onDelete={p.onDelete} />
      </View>
    );
  }
  if (s.kind === 'connection') {
    return (
      <View style={styles.box} testID="inspector-connection">
        <Text variant="bodyStrong">Connection</Text>
        <Text tone="muted">
          {s.fromName} → {s.toName}
        </Text>
        <Text variant="number" testID="connection-conductors">
          {s.pairs.join('  ')}
        </Text>
        <Actions editable={p.editable} onDelete={p.onDelete} deleteLabel="Delete connection" />
        {p.changeDestination ? <WhatIfChangeForm target={{ kind: 'connection', id: s.id, conductors: s.conductors }} destination={p.changeDestination} onAdd={p.onAddChange} /> : null}
      </View>
    );
  }
  const e = s.element;
  const target: ChangeTarget | null =
    e.kind === 'run'
      ? { kind: 'run', id: e.id, conductors: Object.keys((s.readable.conductors ?? {}) as object) as ConductorId[] }
      : e.kind === 'bus'
        ? { kind: 'bus', id: e.id }
        : null;
  return (
    <View style={styles.box} testID="inspector-element">
      <Text variant="caption" tone="muted">
        {s.kindLabel.toUpperCase()}
      </Text>
      <Actions editable={p.editable} onRotate={p.onRotate} onDuplicate={p.onDuplicate} onDelete={p.onDelete} />
      {e.kind === 'bus' && p.onOpenSchedule ? (
        <Button label="Panel schedule" icon="list" variant="secondary" compact onPress={() => p.onOpenSchedule!(e.id)} testID="inspector-schedule" style={styles.scheduleButton} />
      ) : null}
      {s.invalid.length ? (
        <Text variant="small" tone="danger" role="alert" testID="inspector-invalid">
          Left out of the results until fixed: {s.invalid.join('; ')}
        </Text>
      ) : null}
      {s.feed ? (
        <ChoiceField
          label={`Fed from ${s.feed.busName}`}
          value={s.feed.phases.join('')}
          options={s.feed.options.map((o) => ({ value: o.join(''), label: o.length === 1 ? `Phase ${o[0]}` : `${o[0]}–${o[1]}` }))}
          disabled={!p.editable}
          onChange={(v) => p.onSetPhases(s.feed!.connectionId, e.id, v.split('') as PhaseId[])}
          testID="field-feed-phase"
        />
      ) : null}
      <InspectorForm key={e.id} element={e} readable={s.readable} defs={s.defs} editable={p.editable} onSave={(w) => p.onSave(e.id, w)} />
      {p.changeDestination && target ? <WhatIfChangeForm target={target} destination={p.changeDestination} onAdd={p.onAddChange} /> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  box: { gap: space.md },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  scheduleButton: { alignSelf: 'flex-start' },
});
