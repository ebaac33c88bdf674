// Sign in with e-mail and password.
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
import { signInForm } from '@/shared/client/auth-forms';
import { applyServerErrors } from '@/shared/client/form-errors';
import { useSession, useSignIn } from '@/shared/client/queries';

export default function SignInScreen() {
  const router = useRouter();
  const session = useSession();
  const signIn = useSignIn();
  const [formError, setFormError] = useState<string | null>(null);
  const { control, handleSubmit, setError, formState } = useForm({
    resolver: zodResolver(signInForm),
    defaultValues: { email: '', password: '' },
  });

  const submit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      await signIn.mutateAsync(values);
      router.replace('/');
    } catch (error) {
      setFormError(applyServerErrors(error, ['email', 'password'], setError));
    }
  });

  if (session.isPending) return <LoadingState />;
  if (session.data && !formState.isSubmitting) return <Redirect href="/" />;

  return (
    <AuthFrame
      title="Sign in"
      intro="Your projects and sheets are waiting."
      testID="sign-in-screen"
      footer={
        <>
          <Text variant="small" tone="muted">
            New to Phasewright?
          </Text>
          <TextLink label="Make an account" onPress={() => router.push('/sign-up')} testID="go-sign-up" />
        </>
      }
    >
      <Stack.Screen options={{ title: 'Sign in · Phasewright' }} />
      <FormMessage message={formError} />
      <ControlledTextField
        control={control}
        name="email"
        label="E-mail"
        autoComplete="email"
        keyboardType="email-address"
        autoCapitalize="none"
        inputMode="email"
        returnKeyType="next"
        testID="email"
      />
      <ControlledTextField
        control={control}
        name="password"
        label="Password"
        secureTextEntry
        autoComplete="current-password"
        returnKeyType="go"
        onSubmitEditing={submit}
        testID="password"
      />
      <Button label="Sign in" onPress={submit} loading={formState.isSubmitting} block testID="sign-in-submit" />
      <TextLink label="Forgot your password?" onPress={() => router.push('/forgot-password')} testID="go-forgot" />
    </AuthFrame>
  );
}
