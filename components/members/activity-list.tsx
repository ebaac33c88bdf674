// The project's membership record for owners: one short line per change, newest first.
import { StyleSheet, View } from 'react-native';
import type { ActivityEntry } from '@/shared/client/api-client';
import { space } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { Card } from '../ui/card';
import { Loadable, type LoadableState } from '../ui/loadable';
import { Text } from '../ui/text';
import { activityText, shortDateTime } from './activity-line';

const SHOWN = 20;

export function ActivityList({ activity }: { activity: LoadableState<ActivityEntry[]> }) {
  const { color } = useTheme();
  return (
    <Loadable state={activity} loadingLabel="Loading activity…" errorTitle="Could not load the activity" testID="activity">
      {(entries) =>
        entries.length === 0 ? (
          <Text variant="small" tone="faint" testID="activity-none">
            No changes to the members yet.
          </Text>
        ) : (
          <Card testID="activity-list">
            {entries.slice(0, SHOWN).map((entry, index) => (
              <View
                key={entry.id}
                style={[styles.line, index > 0 && { borderTopWidth: 1, borderTopColor: color.line }]}
                testID="activity-line"
              >
                <Text variant="small" style={styles.words}>
                  {activityText(entry)}
                </Text>
                <Text variant="number" tone="faint">
                  {shortDateTime(entry.at)}
                </Text>
              </View>
            ))}
          </Card>
        )
      }
    </Loadable>
  );
}

const styles = StyleSheet.create({
  line: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'baseline', columnGap: space.md, rowGap: space.xxs, paddingHorizontal: space.lg, paddingVertical: space.md },
  words: { flexGrow: 1, flexShrink: 1, flexBasis: 200 },
});
