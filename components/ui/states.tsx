// What a view shows while it loads, when it failed, and when there is nothing in it yet.
import type { ReactNode } from 'react';
import { ActivityIndicator, StyleSheet, View } from 'react-native';
import { space } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { Button } from './button';
import { Icon, type IconName } from './icon';
import { Text } from './text';

export function LoadingState({ label = 'Loading…', testID }: { label?: string; testID?: string }) {
  const { color } = useTheme();
  return (
    <View style={styles.box} testID={testID ?? 'loading'} accessibilityRole="progressbar" aria-busy>
      <ActivityIndicator color={color.primary} />
      <Text variant="small" tone="muted" align="center">
        {label}
      </Text>
    </View>
  );
}

export interface EmptyStateProps {
  icon?: IconName;
  title: string;
  message?: string;
  action?: ReactNode;
  testID?: string;
}

export function EmptyState({ icon = 'file', title, message, action, testID }: EmptyStateProps) {
  const { color } = useTheme();
  return (
    <View style={styles.box} testID={testID}>
      <View style={[styles.iconRing, { borderColor: color.lineStrong }]}>
        <Icon name={icon} size={22} color={color.inkMuted} />
      </View>
      <Text variant="heading" align="center">
        {title}
      </Text>
      {message ? (
        <Text variant="small" tone="muted" align="center" style={styles.message}>
          {message}
        </Text>
      ) : null}
      {action}
    </View>
  );
}

export interface ErrorStateProps {
  title?: string;
  message: string;
  onRetry?: () => void;
  retrying?: boolean;
  testID?: string;
}

export function ErrorState({ title = 'Could not load this', message, onRetry, retrying, testID }: ErrorStateProps) {
  const { color } = useTheme();
  return (
    <View style={styles.box} testID={testID ?? 'error-state'} role="alert">
      <View style={[styles.iconRing, { borderColor: color.danger }]}>
        <Icon name="alert-triangle" size={22} color={color.danger} />
      </View>
      <Text variant="heading" align="center">
        {title}
      </Text>
      <Text variant="small" tone="muted" align="center" style={styles.message}>
        {message}
      </Text>
      {onRetry ? (
        <Button label="Try again" icon="refresh-cw" variant="secondary" onPress={onRetry} loading={retrying} testID="retry" />
      ) : null}
    </View>
  );
}

/** A message at the top of a form for errors that belong to no one field. */
export function FormMessage({ message, tone = 'danger', testID }: { message: string | null | undefined; tone?: 'danger' | 'success'; testID?: string }) {
  const { color, radius } = useTheme();
  if (!message) return null;
  const danger = tone === 'danger';
  return (
    <View
      testID={testID ?? 'form-message'}
      role={danger ? 'alert' : 'status'}
      style={[
        styles.banner,
        {
          borderRadius: radius.md,
          backgroundColor: danger ? color.dangerSoft : color.raised,
          borderColor: danger ? color.danger : color.success,
        },
      ]}
    >
      <Icon name={danger ? 'alert-circle' : 'check-circle'} size={18} color={danger ? color.danger : color.success} />
      <Text variant="small" style={styles.bannerText}>
        {message}
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  box: { alignItems: 'center', justifyContent: 'center', gap: space.md, paddingVertical: space.xxl, paddingHorizontal: space.lg },
  iconRing: { width: 52, height: 52, borderRadius: 26, borderWidth: 1.5, alignItems: 'center', justifyContent: 'center' },
  message: { maxWidth: 420 },
  banner: { flexDirection: 'row', alignItems: 'flex-start', gap: space.sm, borderWidth: 1, padding: space.md },
  bannerText: { flex: 1 },
});
