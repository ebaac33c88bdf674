// A choice among a few named options, as a row of full-size buttons (more than six fold into a list that opens).
import { useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import { radius, space, touchTargetMin } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { Icon } from '../ui/icon';
import { Text } from '../ui/text';

export interface ChoiceFieldProps {
  label: string;
  value: string;
  options: { value: string; label: string }[];
  onChange: (value: string) => void;
  disabled?: boolean;
  error?: string;
  hint?: string;
  testID?: string;
}

export function ChoiceField({ label, value, options, onChange, disabled, error, hint, testID }: ChoiceFieldProps) {
  const { color } = useTheme();
  const [open, setOpen] = useState(false);
  const folded = options.length > 6;
  const current = options.find((o) => o.value === value)?.label ?? value;
  const list = (
    <View style={styles.options}>
      {options.map((o) => {
        const on = o.value === value;
        return (
          <Pressable
            key={o.value}
            disabled={disabled}
            onPress={() => {
              setOpen(false);
              if (!on) onChange(o.value);
            }}
            accessibilityRole="radio"
            accessibilityState={{ checked: on, disabled }}
            testID={testID ? `${testID}-${o.value}` : undefined}
            style={({ pressed }) => [styles.option, { borderColor: on ? color.primary : color.lineStrong, backgroundColor: on ? color.primary : pressed ? color.raised : color.surface }]}
          >
            <Text variant="small" style={{ color: on ? color.onPrimary : color.ink }}>
              {o.label}
            </Text>
          </Pressable>
        );
      })}
    </View>
  );
  return (
    <View style={styles.field} testID={testID} accessibilityLabel={label}>
      <Text variant="label" tone="muted">
        {label}
      </Text>
      {disabled ? (
        // Read only (a viewer): the value as plain text, not buttons that look pressable and do nothing.
        <View style={[styles.readOnly, { borderColor: color.line }]} testID={testID ? `${testID}-value` : undefined}>
          <Text>{current || '—'}</Text>
        </View>
      ) : folded ? (
        <>
          <Pressable
            disabled={disabled}
            onPress={() => setOpen((o) => !o)}
            accessibilityRole="button"
            accessibilityLabel={`${label}: ${current}`}
            testID={testID ? `${testID}-open` : undefined}
            style={[styles.folded, { borderColor: color.lineStrong, backgroundColor: color.surface }]}
          >
            <Text style={styles.foldedText}>{current}</Text>
            {!disabled ? <Icon name={open ? 'chevron-up' : 'chevron-down'} size={18} color={color.inkMuted} /> : null}
          </Pressable>
          {open ? list : null}
        </>
      ) : (
        list
      )}
      {error ? (
        <Text variant="small" tone="danger" role="alert" testID={testID ? `${testID}-error` : undefined}>
          {error}
        </Text>
      ) : hint ? (
        <Text variant="small" tone="faint">
          {hint}
        </Text>
      ) : null}
    </View>
  );
}

export function ToggleField({ label, value, onChange, disabled, hint, testID }: { label: string; value: boolean; onChange: (v: boolean) => void; disabled?: boolean; hint?: string; testID?: string }) {
  const { color } = useTheme();
  return (
    <Pressable
      disabled={disabled}
      onPress={() => onChange(!value)}
      accessibilityRole="checkbox"
      accessibilityState={{ checked: value, disabled }}
      accessibilityLabel={label}
      testID={testID}
      style={[styles.toggle, disabled && styles.dimmed]}
    >
      <View style={[styles.box, { borderColor: value ? color.primary : color.lineStrong, backgroundColor: value ? color.primary : color.surface }]}>
        {value ? <Icon name="check" size={16} color={color.onPrimary} /> : null}
      </View>
      <View style={styles.toggleText}>
        <Text>{label}</Text>
        {hint ? (
          <Text variant="small" tone="faint">
            {hint}
          </Text>
        ) : null}
      </View>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  field: { gap: space.xs },
  options: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs },
  option: { minHeight: touchTargetMin, borderWidth: 1, borderRadius: radius.md, paddingHorizontal: space.md, justifyContent: 'center' },
  folded: { minHeight: 48, borderWidth: 1, borderRadius: radius.md, paddingHorizontal: space.md, flexDirection: 'row', alignItems: 'center' },
  foldedText: { flex: 1 },
  toggle: { minHeight: touchTargetMin, flexDirection: 'row', alignItems: 'center', gap: space.md },
  box: { width: 24, height: 24, borderRadius: 6, borderWidth: 1.5, alignItems: 'center', justifyContent: 'center' },
  toggleText: { flex: 1 },
  readOnly: { minHeight: 40, borderBottomWidth: 1, justifyContent: 'center' },
  dimmed: { opacity: 0.6 },
});
