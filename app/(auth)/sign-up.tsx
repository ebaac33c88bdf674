// Make an account: name, e-mail, password.
import { zodResolver } from '@hookform/resolvers/zod';
import { Redirect, Stack, useRouter } from 'expo-router';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { ControlledTextField } from '@/components/forms/controlled-text-field';
import { AuthFrame } from '@/components/layout/auth-frame';
import { Button } from '@/components/ui/button';
import { FormMessage, LoadingState } from '@/components/ui/states';
import { Text } from '@/components/ui/text';
import { TextLink } from '@/components/ui/text-link';
import { signUpForm } from '@/shared/client/auth-forms';
import { applyServerErrors } from '@/shared/client/form-errors';
import { useSession, useSignUp } from '@/shared/client/queries';

export default function SignUpScreen() {
  const router = useRouter();
  const session = useSession();
  const signUp = useSignUp();
  const [formError, setFormError] = useState<string | null>(null);
  const { control, handleSubmit, setError, formState } = useForm({
    resolver: zodResolver(signUpForm),
    defaultValues: { name: '', email: '', password: '' },
  });

  const submit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      await signUp.mutateAsync(values);
      router.replace('/');
    } catch (error) {
      setFormError(applyServerErrors(error, ['name', 'email', 'password'], setError));
    }
  });

  if (session.isPending) return <LoadingState />;
  if (session.data && !formState.isSubmitting) return <Redirect href="/" />;

  return (
    <AuthFrame
      title="Make an account"
      intro="Draw and check your distribution systems with your team."
      testID="sign-up-screen"
      footer={
        <>
          <Text variant="small" tone="muted">
            Have an account?
          </Text>
          <TextLink label="Sign in" onPress={() => router.replace('/sign-in')} testID="go-sign-in" />
        </>
      }
    >
      <Stack.Screen options={{ title: 'Make an account · Phasewright' }} />
      <FormMessage message={formError} />
      <ControlledTextField control={control} name="name" label="Your name" autoComplete="name" testID="name" />
      <ControlledTextField
        control={control}
        name="email"
        label="E-mail"
        autoComplete="email"
        keyboardType="email-address"
        autoCapitalize="none"
        inputMode="email"
        testID="email"
      />
      <ControlledTextField
        control={control}
        name="password"
        label="Password"
        hint="At least 8 characters."
        secureTextEntry
        autoComplete="new-password"
        onSubmitEditing={submit}
        testID="password"
      />
      <Button label="Make account" onPress={submit} loading={formState.isSubmitting} block testID="sign-up-submit" />
    </AuthFrame>
  );
}
