// Set a new password from the e-mailed link (?token=...). better-auth sends ?error=INVALID_TOKEN for a spent link.
import { zodResolver } from '@hookform/resolvers/zod';
import { Stack, useLocalSearchParams, useRouter } from 'expo-router';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { ControlledTextField } from '@/components/forms/controlled-text-field';
import { AuthFrame } from '@/components/layout/auth-frame';
import { Button } from '@/components/ui/button';
import { FormMessage } from '@/components/ui/states';
import { TextLink } from '@/components/ui/text-link';
import { resetPasswordForm } from '@/shared/client/auth-forms';
import { applyServerErrors } from '@/shared/client/form-errors';
import { useResetPassword } from '@/shared/client/queries';

export default function ResetPasswordScreen() {
  const router = useRouter();
  const params = useLocalSearchParams<{ token?: string; error?: string }>();
  const token = typeof params.token === 'string' ? params.token : '';
  const resetPassword = useResetPassword();
  const [done, setDone] = useState(false);
  const [formError, setFormError] = useState<string | null>(null);
  const { control, handleSubmit, setError, formState } = useForm({
    resolver: zodResolver(resetPasswordForm),
    defaultValues: { password: '', confirm: '' },
  });

  const submit = handleSubmit(async ({ password }) => {
    setFormError(null);
    try {
      await resetPassword.mutateAsync({ newPassword: password, token });
      setDone(true);
    } catch (error) {
      setFormError(applyServerErrors(error, ['password'], setError));
    }
  });

  const linkBroken = !token || !!params.error;

  return (
    <AuthFrame
      title="Choose a new password"
      testID="reset-screen"
      footer={<TextLink label="Back to sign in" onPress={() => router.replace('/sign-in')} testID="go-sign-in" />}
    >
      <Stack.Screen options={{ title: 'New password · Phasewright' }} />
      {done ? (
        <>
          <FormMessage tone="success" testID="reset-done" message="Your password is changed. Sign in with the new one." />
          <Button label="Sign in" onPress={() => router.replace('/sign-in')} block testID="reset-go-sign-in" />
        </>
      ) : linkBroken ? (
        <>
          <FormMessage
            testID="reset-link-broken"
            message={
              params.error
                ? 'This reset link is not valid any more. Ask for a new one.'
                : 'This page needs the link from the reset e-mail. Ask for a new one.'
            }
          />
          <Button label="Ask for a new link" onPress={() => router.replace('/forgot-password')} block />
        </>
      ) : (
        <>
          <FormMessage message={formError} />
          <ControlledTextField
            control={control}
            name="password"
            label="New password"
            hint="At least 8 characters."
            secureTextEntry
            autoComplete="new-password"
            testID="new-password"
          />
          <ControlledTextField
            control={control}
            name="confirm"
            label="New password again"
            secureTextEntry
            autoComplete="new-password"
            onSubmitEditing={submit}
            testID="confirm-password"
          />
          <Button label="Save new password" onPress={submit} loading={formState.isSubmitting} block testID="reset-submit" />
        </>
      )}
    </AuthFrame>
  );
}
