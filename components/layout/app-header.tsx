// The header of every signed-in screen: back (or the product's name), the screen's title, who is signed in
// and the sign-out button.
import { StyleSheet, View } from 'react-native';
import { useSafeAreaInsets } from 'react-native-safe-area-context';
import { space } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { Button, IconButton } from '../ui/button';
import { Text } from '../ui/text';
import { useResponsive } from './use-responsive';

export interface AppHeaderProps {
  title: string;
  onBack?: () => void;
  userName?: string;
  /** Absent on the few screens open to everyone when nobody is signed in. */
  onSignOut?: () => void;
  signingOut?: boolean;
}

export function AppHeader({ title, onBack, userName, onSignOut, signingOut }: AppHeaderProps) {
  const { color } = useTheme();
  const insets = useSafeAreaInsets();
  const { isPhone } = useResponsive();
  return (
    <View
      testID="app-header"
      style={[styles.bar, { paddingTop: insets.top, backgroundColor: color.surface, borderBottomColor: color.line }]}
    >
      <View style={styles.row}>
        {onBack ? (
          <IconButton icon="chevron-left" label="Back" onPress={onBack} testID="header-back" />
        ) : (
          <View style={styles.mark} accessibilityElementsHidden>
            <View style={[styles.markDot, { backgroundColor: color.primary }]} />
          </View>
        )}
        <View style={styles.titles}>
          <Text variant="heading" numberOfLines={1} testID="header-title" role="heading">
            {title}
          </Text>
        </View>
        {userName && !isPhone ? (
          <Text variant="small" tone="muted" numberOfLines={1} style={styles.user} testID="header-user">
            {userName}
          </Text>
        ) : null}
        {onSignOut ? (
          <Button
            label="Sign out"
            icon="log-out"
            variant="quiet"
            compact
            onPress={onSignOut}
            loading={signingOut}
            testID="sign-out"
          />
        ) : null}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  bar: { borderBottomWidth: 1 },
  row: { minHeight: 56, flexDirection: 'row', alignItems: 'center', paddingHorizontal: space.sm, gap: space.sm },
  mark: { width: 44, height: 44, alignItems: 'center', justifyContent: 'center' },
  markDot: { width: 14, height: 14, borderRadius: 3, transform: [{ rotate: '45deg' }] },
  titles: { flex: 1, minWidth: 0 },
  user: { maxWidth: 220 },
});
