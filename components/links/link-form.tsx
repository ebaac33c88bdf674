// Makes a viewer link: an optional label (who it is for) and an optional number of days before it stops working.
import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { z } from 'zod';
import type { ViewerLinkCreateBody } from '@/shared/client/api-client';
import { applyServerErrors } from '@/shared/client/form-errors';
import { ControlledTextField } from '../forms/controlled-text-field';
import { space } from '../theme/tokens';
import { Button } from '../ui/button';
import { FormMessage } from '../ui/states';

export const linkForm = z.object({
  label: z.string().trim().max(120, 'Label must be at most 120 characters'),
  expiresInDays: z
    .string()
    .trim()
    .regex(/^\d*$/, 'Whole days only, e.g. 30')
    .refine((v) => v === '' || (Number(v) >= 1 && Number(v) <= 365), 'From 1 to 365 days, or leave it empty'),
});
export type LinkForm = z.infer<typeof linkForm>;

/** The form's text fields as the API's body: empty means "no label" and "never expires". */
export function linkBody(values: LinkForm): ViewerLinkCreateBody {
  return {
    ...(values.label ? { label: values.label } : {}),
    ...(values.expiresInDays ? { expiresInDays: Number(values.expiresInDays) } : {}),
  };
}

export function LinkForm({ onSubmit }: { onSubmit: (body: ViewerLinkCreateBody) => Promise<void> }) {
  const [formError, setFormError] = useState<string | null>(null);
  const { control, handleSubmit, setError, reset, formState } = useForm<LinkForm>({
    resolver: zodResolver(linkForm),
    defaultValues: { label: '', expiresInDays: '' },
  });
  const submit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      await onSubmit(linkBody(values));
      reset();
    } catch (error) {
      setFormError(applyServerErrors(error, ['label', 'expiresInDays'], setError));
    }
  });
  return (
    <View style={styles.form} testID="link-form">
      <FormMessage message={formError} testID="link-error" />
      <ControlledTextField
        control={control}
        name="label"
        label="Label (optional)"
        placeholder="e.g. For the building owner"
        testID="link-label"
      />
      <ControlledTextField
        control={control}
        name="expiresInDays"
        label="Stops working after (days, optional)"
        placeholder="Never"
        keyboardType="number-pad"
        inputMode="numeric"
        hint="Leave empty for a link that works until you revoke it."
        onSubmitEditing={submit}
        testID="link-days"
      />
      <Button label="Make link" icon="link" onPress={submit} loading={formState.isSubmitting} block testID="link-submit" />
    </View>
  );
}

const styles = StyleSheet.create({ form: { gap: space.md } });
