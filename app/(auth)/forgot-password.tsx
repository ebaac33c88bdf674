// Ask for a password reset link by e-mail.
import { zodResolver } from '@hookform/resolvers/zod';
import { Stack, useRouter } from 'expo-router';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { ControlledTextField } from '@/components/forms/controlled-text-field';
import { AuthFrame } from '@/components/layout/auth-frame';
import { Button } from '@/components/ui/button';
import { FormMessage } from '@/components/ui/states';
import { Text } from '@/components/ui/text';
import { TextLink } from '@/components/ui/text-link';
import { resolveAppOrigin } from '@/shared/client/api-base-url';
import { forgotPasswordForm } from '@/shared/client/auth-forms';
import { applyServerErrors } from '@/shared/client/form-errors';
import { useHealth, useRequestPasswordReset } from '@/shared/client/queries';

export default function ForgotPasswordScreen() {
  const router = useRouter();
  const requestReset = useRequestPasswordReset();
  const health = useHealth();
  const [sentTo, setSentTo] = useState<string | null>(null);
  const [formError, setFormError] = useState<string | null>(null);
  const { control, handleSubmit, setError, formState } = useForm({
    resolver: zodResolver(forgotPasswordForm),
    defaultValues: { email: '' },
  });

  const submit = handleSubmit(async ({ email }) => {
    setFormError(null);
    try {
      await requestReset.mutateAsync({ email, redirectTo: `${resolveAppOrigin()}/reset-password` });
      setSentTo(email);
    } catch (error) {
      setFormError(applyServerErrors(error, ['email'], setError));
    }
  });

  const localMail = health.data?.mail === 'local-sink';

  return (
    <AuthFrame
      title="Reset your password"
      intro="We send a link to your e-mail. It works once and for a short time."
      testID="forgot-screen"
      footer={<TextLink label="Back to sign in" onPress={() => router.replace('/sign-in')} testID="go-sign-in" />}
    >
      <Stack.Screen options={{ title: 'Reset password · Phasewright' }} />
      {sentTo ? (
        <>
          <FormMessage
            tone="success"
            testID="reset-sent"
            message={`If an account uses ${sentTo}, a reset link is on its way. Check your inbox.`}
          />
          {localMail ? (
            <>
              <Text variant="small" tone="muted">
                On this machine mail goes to the local outbox instead of the internet.
              </Text>
              <Button label="Open the outbox" icon="inbox" variant="secondary" onPress={() => router.push('/outbox')} testID="open-outbox" />
            </>
          ) : null}
          <Button label="Send again" variant="quiet" onPress={() => setSentTo(null)} />
        </>
      ) : (
        <>
          <FormMessage message={formError} />
          <ControlledTextField
            control={control}
            name="email"
            label="E-mail"
            autoComplete="email"
            keyboardType="email-address"
            autoCapitalize="none"
            inputMode="email"
            onSubmitEditing={submit}
            testID="email"
          />
          <Button label="Send reset link" onPress={submit} loading={formState.isSubmitting} block testID="forgot-submit" />
        </>
      )}
    </AuthFrame>
  );
}
