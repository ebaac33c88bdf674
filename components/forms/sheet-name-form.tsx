// Names a new sheet or renames one, checked with the API's sheet schema.
import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { View } from 'react-native';
import { sheetCreateBody, type SheetCreateBody } from '@/shared/api';
import { applyServerErrors } from '@/shared/client/form-errors';
import { space } from '../theme/tokens';
import { Button } from '../ui/button';
import { FormMessage } from '../ui/states';
import { ControlledTextField } from './controlled-text-field';

export interface SheetNameFormProps {
  defaultName?: string;
  submitLabel: string;
  onSubmit: (values: SheetCreateBody) => Promise<void>;
}

export function SheetNameForm({ defaultName = '', submitLabel, onSubmit }: SheetNameFormProps) {
  const [formError, setFormError] = useState<string | null>(null);
  const { control, handleSubmit, setError, formState } = useForm({
    resolver: zodResolver(sheetCreateBody),
    defaultValues: { name: defaultName },
  });
  const submit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      await onSubmit(values);
    } catch (error) {
      setFormError(applyServerErrors(error, ['name'], setError));
    }
  });
  return (
    <View style={{ gap: space.lg }}>
      <FormMessage message={formError} />
      <ControlledTextField
        control={control}
        name="name"
        label="Sheet name"
        placeholder="e.g. Service and house panel"
        autoFocus
        selectTextOnFocus
        returnKeyType="done"
        onSubmitEditing={submit}
        testID="sheet-name"
      />
      <Button label={submitLabel} onPress={submit} loading={formState.isSubmitting} block testID="sheet-submit" />
    </View>
  );
}
