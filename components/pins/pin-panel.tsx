// The pins of a sheet where the results are read: the list (open pins first), the thread of the pin opened from
// its flag, the box for a new pin once a place was tapped, and, for a visitor without a name yet, the name form.
import { Pressable, StyleSheet, View } from 'react-native';
import type { PinThread } from '@/shared/client/api-client';
import { radius, space } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { Button } from '../ui/button';
import { plural } from '../ui/format';
import { Text } from '../ui/text';
import { GuestNameForm } from './guest-name-form';
import { NoteBox } from './note-box';
import { PinFlag } from './pin-flag';
import { PinThreadView, type PinThreadProps } from './pin-thread';

export interface PinPanelProps {
  pins: PinThread[];
  loading: boolean;
  error: string | null;
  placeOf: (pin: PinThread) => string;
  openPin: PinThread | null;
  /** A place tapped for a new pin, described ("on Load A"), waiting for its text. */
  draft: string | null;
  /** Null: may look but must give a name (a visitor) before writing. */
  canWrite: boolean;
  askName: boolean;
  naming: boolean;
  posting: boolean;
  placing: boolean;
  thread: Omit<PinThreadProps, 'pin' | 'place' | 'onBack' | 'canWrite'>;
  onOpen: (pinId: string | null) => void;
  onStartPin: () => void;
  onPost: (text: string) => Promise<unknown>;
  onCancelDraft: () => void;
  onGiveName: (name: string) => Promise<unknown>;
}

export function PinPanel(p: PinPanelProps) {
  const { color } = useTheme();
  if (p.askName && (p.draft || p.placing)) {
    return <GuestNameForm busy={p.naming} onGiveName={p.onGiveName} />;
  }
  if (p.draft) {
    return (
      <View style={styles.gap} testID="pin-draft">
        <Text variant="bodyStrong">New pin {p.draft}</Text>
        <NoteBox label="Comment" sendLabel="Pin it" busy={p.posting} onSend={p.onPost} onCancel={p.onCancelDraft} testID="pin-new" autoFocus />
      </View>
    );
  }
  if (p.openPin) {
    return <PinThreadView {...p.thread} pin={p.openPin} place={p.placeOf(p.openPin)} canWrite={p.canWrite && !p.askName} onBack={() => p.onOpen(null)} />;
  }
  const open = p.pins.filter((x) => !x.resolvedAt);
  const resolved = p.pins.filter((x) => x.resolvedAt);
  return (
    <View style={styles.gap} testID="pin-list">
      <View style={styles.listHead}>
        <Text variant="small" tone="muted" style={styles.grow}>
          {p.loading ? 'Reading the pins…' : p.pins.length === 0 ? 'No pins yet.' : `${plural(open.length, 'open pin')}, ${resolved.length} resolved`}
        </Text>
        {p.canWrite || p.askName ? <Button label="Add a pin" icon="flag" variant="quiet" compact onPress={p.onStartPin} testID="pin-add" /> : null}
      </View>
      {p.error ? (
        <Text variant="small" tone="danger">
          {p.error}
        </Text>
      ) : null}
      {[...open, ...resolved].map((pin) => (
        <Pressable
          key={pin.id}
          onPress={() => p.onOpen(pin.id)}
          accessibilityRole="button"
          accessibilityLabel={`Pin ${pin.number} ${p.placeOf(pin)}`}
          testID={`pin-row-${pin.number}`}
          style={({ pressed }) => [styles.row, { borderColor: color.line }, pressed && { backgroundColor: color.raised }]}
        >
          <PinFlag number={pin.number} resolved={pin.resolvedAt !== null} open={false} />
          <View style={styles.grow}>
            <Text numberOfLines={2}>{pin.body}</Text>
            <Text variant="caption" tone="muted" numberOfLines={1}>
              {pin.author.name} {p.placeOf(pin)}
              {pin.replies.length ? ` · ${plural(pin.replies.length, 'reply', 'replies')}` : ''}
              {pin.attachments.length ? ` · ${plural(pin.attachments.length, 'file')}` : ''}
            </Text>
          </View>
        </Pressable>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  gap: { gap: space.sm },
  listHead: { flexDirection: 'row', alignItems: 'center', gap: space.sm, minHeight: 44 },
  grow: { flex: 1, minWidth: 0 },
  row: { flexDirection: 'row', alignItems: 'center', gap: space.sm, borderWidth: 1, borderRadius: radius.md, padding: space.sm, minHeight: 52 },
});
