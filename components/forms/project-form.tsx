// The project form (name and description), checked with the API's own schema; server field errors go under
// their fields.
import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { View } from 'react-native';
import { projectCreateBody, type ProjectCreateBody } from '@/shared/api';
import { applyServerErrors } from '@/shared/client/form-errors';
import { space } from '../theme/tokens';
import { Button } from '../ui/button';
import { FormMessage } from '../ui/states';
import { ControlledTextField } from './controlled-text-field';

export interface ProjectFormProps {
  defaultValues?: ProjectCreateBody;
  submitLabel: string;
  onSubmit: (values: ProjectCreateBody) => Promise<void>;
}

export function ProjectForm({ defaultValues, submitLabel, onSubmit }: ProjectFormProps) {
  const [formError, setFormError] = useState<string | null>(null);
  const { control, handleSubmit, setError, formState } = useForm({
    resolver: zodResolver(projectCreateBody),
    defaultValues: defaultValues ?? { name: '', description: '' },
  });
  const submit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      await onSubmit(values);
    } catch (error) {
      setFormError(applyServerErrors(error, ['name', 'description'], setError));
    }
  });
  return (
    <View style={{ gap: space.lg }}>
      <FormMessage message={formError} />
      <ControlledTextField
        control={control}
        name="name"
        label="Project name"
        placeholder="e.g. Larkspur Row"
        autoFocus
        returnKeyType="next"
        testID="project-name"
      />
      <ControlledTextField
        control={control}
        name="description"
        label="Description (optional)"
        placeholder="Site, client, what the study is for"
        multiline
        testID="project-description"
      />
      <Button label={submitLabel} onPress={submit} loading={formState.isSubmitting} block testID="project-submit" />
    </View>
  );
}
