// A labelled text input with its error message under it. Takes a ref so react-hook-form can focus it.
import { useState, type Ref } from 'react';
import { Platform, StyleSheet, TextInput, View, type TextInputProps, type TextStyle } from 'react-native';
import { fontFamily, radius, space } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { Text } from './text';

export interface TextFieldProps extends Omit<TextInputProps, 'style'> {
  label: string;
  error?: string;
  hint?: string;
  ref?: Ref<TextInput>;
}

export function TextField({ label, error, hint, ref, testID, onFocus, onBlur, multiline, ...input }: TextFieldProps) {
  const { color } = useTheme();
  const [focused, setFocused] = useState(false);
  const borderColor = error ? color.danger : focused ? color.primary : color.lineStrong;
  return (
    <View style={styles.field}>
      <Text variant="label" tone="muted" nativeID={testID ? `${testID}-label` : undefined}>
        {label}
      </Text>
      <TextInput
        {...input}
        ref={ref}
        testID={testID}
        multiline={multiline}
        accessibilityLabel={label}
        aria-invalid={!!error}
        placeholderTextColor={color.inkFaint}
        onFocus={(e) => {
          setFocused(true);
          onFocus?.(e);
        }}
        onBlur={(e) => {
          setFocused(false);
          onBlur?.(e);
        }}
        style={[
          styles.input,
          noBrowserRing,
          multiline && styles.multiline,
          { color: color.ink, backgroundColor: color.surface, borderColor, borderWidth: focused || error ? 2 : 1 },
          // Read only: no box that invites typing.
          input.editable === false && { backgroundColor: 'transparent', borderWidth: 0, borderBottomWidth: 1, borderRadius: 0, paddingHorizontal: 0, borderColor: color.line },
        ]}
      />
      {error ? (
        <Text variant="small" tone="danger" testID={testID ? `${testID}-error` : undefined} role="alert">
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

// The border already shows focus in our colours; the browser's own ring would sit on top of it.
const noBrowserRing = (Platform.OS === 'web' ? { outlineStyle: 'none' } : {}) as TextStyle;

const styles = StyleSheet.create({
  field: { gap: space.xs, alignSelf: 'stretch' },
  input: {
    minHeight: 48,
    paddingHorizontal: space.md,
    paddingVertical: space.sm,
    borderRadius: radius.md,
    fontFamily: fontFamily.regular,
    fontSize: 16,
  },
  multiline: { minHeight: 96, textAlignVertical: 'top' },
});
