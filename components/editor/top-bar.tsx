// The strip over the canvas: back, the sheet's name and the case on show, the crew (who is here, in their
// colours) with the connection's state, and the sheet's details.
import { Pressable, StyleSheet, View } from 'react-native';
import { useSafeAreaInsets } from 'react-native-safe-area-context';
import type { CrewPerson } from '@/editor/presence/crew';
import type { ConnectionStatus } from '@/editor/session/sheet-session';
import { radius, space, touchTargetMin } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { IconButton } from '../ui/button';
import { Text } from '../ui/text';

export interface TopBarProps {
  sheetName: string;
  caseLabel: string;
  readOnly: boolean;
  /** One entry per person. */
  crew: CrewPerson[];
  status: ConnectionStatus;
  synced: boolean;
  compact: boolean;
  /** No back button without it (a viewer link's page has nowhere to go back to). */
  onBack?: () => void;
  onCrew: () => void;
  onAbout: () => void;
}

const STATUS_WORD: Record<ConnectionStatus, string> = { connected: 'Live', connecting: 'Connecting…', offline: 'Offline: edits kept here' };

export function TopBar(p: TopBarProps) {
  const { color } = useTheme();
  const insets = useSafeAreaInsets();
  const shown = p.crew.slice(0, p.compact ? 3 : 6);
  const statusColor = p.status === 'connected' ? color.success : p.status === 'connecting' ? color.focus : color.danger;
  return (
    <View testID="editor-top-bar" style={[styles.bar, { paddingTop: insets.top, backgroundColor: color.surface, borderBottomColor: color.line }]}>
      <View style={styles.row}>
        {p.onBack ? <IconButton icon="chevron-left" label="Back to the project" onPress={p.onBack} testID="editor-back" /> : <View style={styles.edge} />}
        <View style={styles.titles}>
          <Text variant="bodyStrong" numberOfLines={1} testID="editor-sheet-name">
            {p.sheetName || 'Untitled sheet'}
          </Text>
          <Text variant="caption" tone="muted" numberOfLines={1} testID="editor-case">
            {p.readOnly ? `View only · ${p.caseLabel}` : p.caseLabel}
          </Text>
        </View>
        <Pressable
          onPress={p.onCrew}
          accessibilityRole="button"
          accessibilityLabel={`Crew: ${p.crew.map((m) => m.name).join(', ')}. ${STATUS_WORD[p.status]}`}
          testID="crew-button"
          style={({ pressed }) => [styles.crew, pressed && { backgroundColor: color.raised }]}
        >
          <View style={[styles.statusDot, { backgroundColor: statusColor }]} testID={`link-${p.status}`} />
          {shown.map((m) => (
            <View key={m.userId} style={[styles.initial, { backgroundColor: m.color }]} testID={`crew-chip-${m.userId}`}>
              <Text variant="caption" style={styles.initialText}>
                {initials(m.name)}
              </Text>
            </View>
          ))}
          {p.crew.length > shown.length ? (
            <Text variant="caption" tone="muted">
              +{p.crew.length - shown.length}
            </Text>
          ) : null}
          {!p.compact ? (
            <Text variant="caption" tone="muted" testID="link-status">
              {STATUS_WORD[p.status]}
            </Text>
          ) : null}
        </Pressable>
        <IconButton icon="info" label="Sheet details" onPress={p.onAbout} testID="editor-about" />
      </View>
    </View>
  );
}

function initials(name: string): string {
  const parts = name.trim().split(/\s+/);
  return ((parts[0]?.[0] ?? '?') + (parts.length > 1 ? parts[parts.length - 1][0] : '')).toUpperCase();
}

const styles = StyleSheet.create({
  bar: { borderBottomWidth: 1 },
  row: { minHeight: 52, flexDirection: 'row', alignItems: 'center', paddingHorizontal: space.xs, gap: space.xs },
  titles: { flex: 1, minWidth: 0 },
  edge: { width: space.sm },
  crew: { minHeight: touchTargetMin, flexDirection: 'row', alignItems: 'center', gap: 4, paddingHorizontal: space.sm, borderRadius: radius.md },
  statusDot: { width: 8, height: 8, borderRadius: 4, marginRight: 2 },
  initial: { width: 26, height: 26, borderRadius: 6, alignItems: 'center', justifyContent: 'center' },
  initialText: { color: '#FFFFFF', letterSpacing: 0 },
});
