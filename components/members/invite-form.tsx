// Invite someone by e-mail with a role. Checked here first; the server's field errors go under the fields, and
// its refusals (already a member, too many invitations) at the top.
import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { Controller, useForm } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { z } from 'zod';
import { roleSchema } from '@/shared/api';
import { isApiError } from '@/shared/client/api-client';
import { applyServerErrors } from '@/shared/client/form-errors';
import { useCreateInvitation } from '@/shared/client/queries';
import { ControlledTextField } from '../forms/controlled-text-field';
import { useResponsive } from '../layout/use-responsive';
import { space } from '../theme/tokens';
import { Button } from '../ui/button';
import { Card } from '../ui/card';
import { FormMessage } from '../ui/states';
import { Text } from '../ui/text';
import { RolePicker } from './role-picker';

export const inviteForm = z.object({
  email: z.string().trim().toLowerCase().min(1, 'Enter an e-mail address').email('Enter a valid e-mail address'),
  role: roleSchema,
});
export type InviteForm = z.infer<typeof inviteForm>;

export function InviteForm({ projectId }: { projectId: string }) {
  const { isPhone } = useResponsive();
  const create = useCreateInvitation(projectId);
  const [formError, setFormError] = useState<string | null>(null);
  const [sentTo, setSentTo] = useState<string | null>(null);
  const { control, handleSubmit, setError, reset, formState } = useForm<InviteForm>({
    resolver: zodResolver(inviteForm),
    defaultValues: { email: '', role: 'editor' },
  });

  const submit = handleSubmit(async (values) => {
    setFormError(null);
    setSentTo(null);
    try {
      const invitation = await create.mutateAsync(values);
      setSentTo(invitation.email);
      reset({ email: '', role: values.role });
    } catch (error) {
      // "Already a member" is about the address typed: show it under the field.
      if (isApiError(error) && error.status === 409) setError('email', { type: 'server', message: error.message }, { shouldFocus: true });
      else setFormError(applyServerErrors(error, ['email', 'role'], setError));
    }
  });

  return (
    <Card style={styles.card} testID="invite-form">
      <FormMessage message={formError} testID="invite-error" />
      <FormMessage message={sentTo ? `Invitation sent to ${sentTo}.` : null} tone="success" testID="invite-sent" />
      <View style={[styles.fields, !isPhone && styles.fieldsWide]}>
        <View style={styles.email}>
          <ControlledTextField
            control={control}
            name="email"
            label="E-mail"
            placeholder="name@example.com"
            autoComplete="email"
            keyboardType="email-address"
            autoCapitalize="none"
            inputMode="email"
            onSubmitEditing={submit}
            testID="invite-email"
          />
        </View>
        <View style={styles.role}>
          <Text variant="label" tone="muted">
            Role
          </Text>
          <Controller
            control={control}
            name="role"
            render={({ field }) => (
              <RolePicker value={field.value} onChange={field.onChange} label="Role for the invited person" testID="invite-role" />
            )}
          />
        </View>
      </View>
      <Text variant="small" tone="faint">
        They get an e-mail with a link that works once, for 7 days.
      </Text>
      <Button
        label="Send invitation"
        icon="send"
        onPress={submit}
        loading={formState.isSubmitting}
        block={isPhone}
        style={!isPhone && styles.submitWide}
        testID="invite-submit"
      />
    </Card>
  );
}

const styles = StyleSheet.create({
  card: { padding: space.lg, gap: space.md },
  fields: { gap: space.md },
  fieldsWide: { flexDirection: 'row', alignItems: 'flex-start' },
  email: { flex: 1 },
  role: { gap: space.xs },
  submitWide: { alignSelf: 'flex-start' },
});
