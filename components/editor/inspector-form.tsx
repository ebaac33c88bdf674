// The inspector's form for one element: its fields by kind, each checked before anything is written. A typed
// value is written when the field loses the focus, a choice or a tick at once; one write is one undo step.
import { zodResolver } from '@hookform/resolvers/zod';
import { useEffect, useMemo } from 'react';
import { Controller, useForm, useWatch } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import type { ElementView } from '@/editor/document/sheet-mirror';
import { readValues, type FieldDef, type FieldValue, type Write } from '@/editor/inspector/fields';
import { checkForm } from '@/editor/inspector/form-check';
import { inspectorSchema } from '@/editor/inspector/form-schema';
import { formatQuantity, parseQuantity } from '@/editor/quantity/parse-quantity';
import { space } from '../theme/tokens';
import { TextField } from '../ui/text-field';
import { Text } from '../ui/text';
import { ChoiceField, ToggleField } from './choice-field';

export interface InspectorFormProps {
  /** The element as stored (raw), and as read through its schema where valid (defaults filled). */
  element: ElementView;
  readable: ElementView;
  defs: FieldDef[];
  editable: boolean;
  onSave: (writes: Write[]) => void;
}

export function InspectorForm({ element, readable, defs, editable, onSave }: InspectorFormProps) {
  const initial = useMemo(() => readValues(defs, readable), [defs, readable]);
  const schema = useMemo(() => inspectorSchema(defs, initial, element), [defs, initial, element]);
  const form = useForm<Record<string, FieldValue>>({ defaultValues: initial, resolver: zodResolver(schema), mode: 'onSubmit' });
  const { control, handleSubmit, reset } = form;
  const values = useWatch({ control }) as Record<string, FieldValue>;

  // A colleague's edit (or undo) changes the element: show it, unless this person is typing a change.
  useEffect(() => {
    reset(initial, { keepDirtyValues: true, keepErrors: true });
  }, [initial, reset]);

  const save = handleSubmit((v) => {
    const checked = checkForm(defs, v, initial, element);
    if (!checked.ok || checked.writes.length === 0) return;
    // Show what was stored ("45 m" becomes 147.638 in a field in feet).
    for (const d of defs) {
      if (d.type !== 'quantity' || v[d.key] === initial[d.key]) continue;
      const parsed = parseQuantity(String(v[d.key]), d.unit);
      if (parsed.ok) form.setValue(d.key, formatQuantity(parsed.value));
    }
    onSave(checked.writes);
  });

  const visible = defs.filter((d) => !d.visible || d.visible({ ...initial, ...values }));
  return (
    <View style={styles.form} testID="inspector-form">
      {visible.map((d) => (
        <Controller
          key={d.key}
          control={control}
          name={d.key}
          render={({ field, fieldState }) => {
            const id = `field-${d.key}`;
            if (d.type === 'toggle') {
              return (
                <ToggleField
                  label={d.label}
                  hint={d.hint}
                  value={field.value === true}
                  disabled={!editable}
                  testID={id}
                  onChange={(v) => {
                    field.onChange(v);
                    void save();
                  }}
                />
              );
            }
            if (d.type === 'choice') {
              return (
                <ChoiceField
                  label={d.label}
                  hint={d.hint}
                  value={String(field.value ?? '')}
                  options={d.options}
                  disabled={!editable}
                  error={fieldState.error?.message}
                  testID={id}
                  onChange={(v) => {
                    field.onChange(v);
                    void save();
                  }}
                />
              );
            }
            return (
              <TextField
                label={d.type === 'quantity' && d.unit !== 'number' && d.unit !== 'percent' ? `${d.label} (${d.unit === 'ohm' ? 'Ω' : d.unit})` : d.label}
                hint={d.hint}
                ref={field.ref}
                value={String(field.value ?? '')}
                editable={editable}
                onChangeText={field.onChange}
                onBlur={() => {
                  field.onBlur();
                  void save();
                }}
                onSubmitEditing={() => void save()}
                error={fieldState.error?.message}
                testID={id}
                autoCapitalize="none"
                autoCorrect={false}
                inputMode={d.type === 'quantity' ? 'text' : undefined}
              />
            );
          }}
        />
      ))}
      {!editable ? (
        <Text variant="small" tone="muted">
          You can look but not change this sheet.
        </Text>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  form: { gap: space.md },
});
