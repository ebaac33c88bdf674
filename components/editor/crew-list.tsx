// Who is on the sheet now, once each however many tabs they have open, each in their colour, and whether the link
// to the others is live.
import { StyleSheet, View } from 'react-native';
import type { CrewPerson } from '@/editor/presence/crew';
import type { ConnectionStatus } from '@/editor/session/sheet-session';
import { space } from '../theme/tokens';
import { Text } from '../ui/text';

export function CrewList({ crew, status }: { crew: CrewPerson[]; status: ConnectionStatus }) {
  return (
    <View style={styles.list} testID="crew-list">
      <Text variant="small" tone="muted" testID="crew-link">
        {status === 'connected' ? 'Live: edits reach everyone as they happen.' : status === 'connecting' ? 'Connecting…' : 'Offline: your edits are kept here and merge when the link returns.'}
      </Text>
      {crew.map((m) => (
        <View key={m.userId} style={styles.row} testID={`crew-member-${m.userId}`}>
          <View style={[styles.swatch, { backgroundColor: m.color }]} />
          <Text style={styles.name}>
            {m.name}
            {m.self ? ' (you)' : ''}
          </Text>
          <Text variant="caption" tone="muted">
            {m.readOnly ? 'Viewing' : 'Editing'}
            {m.tabs > 1 ? ` · ${m.tabs} tabs` : ''}
          </Text>
        </View>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  list: { gap: space.sm },
  row: { flexDirection: 'row', alignItems: 'center', gap: space.sm, minHeight: 36 },
  swatch: { width: 14, height: 14, borderRadius: 4 },
  name: { flex: 1 },
});
