// Sign in or make an account right on the invitation page, with the invited address filled in, so that the
// person comes back to the same page to accept.
import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { signInForm, signUpForm } from '@/shared/client/auth-forms';
import { applyServerErrors } from '@/shared/client/form-errors';
import { useSignIn, useSignUp } from '@/shared/client/queries';
import { ControlledTextField } from '../forms/controlled-text-field';
import { space } from '../theme/tokens';
import { Button } from '../ui/button';
import { FormMessage } from '../ui/states';
import { Text } from '../ui/text';
import { TextLink } from '../ui/text-link';

export function InviteAuthForm({ email }: { email: string }) {
  const [mode, setMode] = useState<'sign-up' | 'sign-in'>('sign-up');
  return (
    <View style={styles.box}>
      <Text variant="bodyStrong">{mode === 'sign-up' ? 'Make an account to accept' : 'Sign in to accept'}</Text>
      {mode === 'sign-up' ? <SignUpPart email={email} /> : <SignInPart email={email} />}
      <View style={styles.switch}>
        <Text variant="small" tone="muted">
          {mode === 'sign-up' ? 'Have an account?' : 'New to Phasewright?'}
        </Text>
        <TextLink
          label={mode === 'sign-up' ? 'Sign in' : 'Make an account'}
          onPress={() => setMode(mode === 'sign-up' ? 'sign-in' : 'sign-up')}
          testID={mode === 'sign-up' ? 'invite-go-sign-in' : 'invite-go-sign-up'}
        />
      </View>
    </View>
  );
}

const emailField = {
  name: 'email' as const,
  label: 'E-mail',
  autoComplete: 'email' as const,
  keyboardType: 'email-address' as const,
  autoCapitalize: 'none' as const,
  inputMode: 'email' as const,
  testID: 'email',
};

function SignUpPart({ email }: { email: string }) {
  const signUp = useSignUp();
  const [formError, setFormError] = useState<string | null>(null);
  const { control, handleSubmit, setError, formState } = useForm({
    resolver: zodResolver(signUpForm),
    defaultValues: { name: '', email, password: '' },
  });
  const submit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      // The session query refreshes; the page then offers Accept.
      await signUp.mutateAsync(values);
    } catch (error) {
      setFormError(applyServerErrors(error, ['name', 'email', 'password'], setError));
    }
  });
  return (
    <View style={styles.form}>
      <FormMessage message={formError} />
      <ControlledTextField control={control} name="name" label="Your name" autoComplete="name" testID="name" />
      <ControlledTextField control={control} {...emailField} hint="The invitation is for this address." />
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
    </View>
  );
}

function SignInPart({ email }: { email: string }) {
  const signIn = useSignIn();
  const [formError, setFormError] = useState<string | null>(null);
  const { control, handleSubmit, setError, formState } = useForm({
    resolver: zodResolver(signInForm),
    defaultValues: { email, password: '' },
  });
  const submit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      await signIn.mutateAsync(values);
    } catch (error) {
      setFormError(applyServerErrors(error, ['email', 'password'], setError));
    }
  });
  return (
    <View style={styles.form}>
      <FormMessage message={formError} />
      <ControlledTextField control={control} {...emailField} />
      <ControlledTextField
        control={control}
        name="password"
        label="Password"
        secureTextEntry
        autoComplete="current-password"
        onSubmitEditing={submit}
        testID="password"
      />
      <Button label="Sign in" onPress={submit} loading={formState.isSubmitting} block testID="sign-in-submit" />
    </View>
  );
}

const styles = StyleSheet.create({
  box: { gap: space.md },
  form: { gap: space.lg },
  switch: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', columnGap: space.md },
});
