// The frame of the signed-out screens: the product's name, the screen's title and a card holding the form.
import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';
import { space } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { Card } from '../ui/card';
import { Text } from '../ui/text';
import { Screen } from './screen';

export interface AuthFrameProps {
  title: string;
  intro?: string;
  children: ReactNode;
  /** Links under the card (to sign up, to sign in). */
  footer?: ReactNode;
  testID?: string;
}

export function AuthFrame({ title, intro, children, footer, testID }: AuthFrameProps) {
  const { color } = useTheme();
  return (
    <Screen padTop centred maxWidth={440} testID={testID}>
      <View style={styles.brand}>
        <View style={[styles.mark, { borderColor: color.primary }]}>
          <View style={[styles.markDot, { backgroundColor: color.primary }]} />
        </View>
        <Text variant="heading" tone="primary">
          Phasewright
        </Text>
      </View>
      <View style={styles.titles}>
        <Text variant="display" role="heading">
          {title}
        </Text>
        {intro ? <Text tone="muted">{intro}</Text> : null}
      </View>
      <Card style={styles.card}>{children}</Card>
      {footer ? <View style={styles.footer}>{footer}</View> : null}
    </Screen>
  );
}

const styles = StyleSheet.create({
  brand: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  mark: { width: 28, height: 28, borderWidth: 2, borderRadius: 6, alignItems: 'center', justifyContent: 'center' },
  markDot: { width: 10, height: 10, borderRadius: 2, transform: [{ rotate: '45deg' }] },
  titles: { gap: space.xs },
  card: { padding: space.xl, gap: space.lg },
  footer: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', justifyContent: 'center', columnGap: space.lg },
});
