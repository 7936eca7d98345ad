import { zodResolver } from '@hookform/resolvers/zod';
import { router, useLocalSearchParams } from 'expo-router';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { useForm } from 'react-hook-form';
import { signInInputSchema, type SignInInput } from '../../shared/schemas/auth';
import { useSignIn } from '../api/auth';
import { Button } from '../ui/button';
import { Callout } from '../ui/callout';
import { FormTextField } from '../ui/form-text-field';
import { applyServerErrors } from '../ui/form-errors';
import { Text } from '../ui/text';
import { TextLink } from '../ui/text-link';
import { AuthCard } from './auth-card';
import { safeNext } from './session';

export function SignInScreen() {
  const { next } = useLocalSearchParams<{ next?: string }>();
  const signIn = useSignIn();
  const [formError, setFormError] = useState<string>();
  const form = useForm<SignInInput>({ resolver: zodResolver(signInInputSchema), defaultValues: { email: '', password: '' } });

  const onSubmit = form.handleSubmit((values) => {
    setFormError(undefined);
    signIn.mutate(values, {
      onSuccess: () => router.replace(safeNext(next)),
      onError: (error) => setFormError(applyServerErrors(error, form.setError, ['email', 'password'])),
    });
  });

  return (
    <AuthCard title="Sign in">
      {formError ? <Callout tone="danger" title="Not signed in">{formError}</Callout> : null}
      <FormTextField control={form.control} name="email" label="Email" autoComplete="email" keyboardType="email-address" autoCapitalize="none" inputMode="email" />
      <FormTextField control={form.control} name="password" label="Password" secureTextEntry autoComplete="current-password" onSubmitEditing={onSubmit} />
      <Button label="Sign in" size="lg" loading={signIn.isPending} onPress={onSubmit} />
      <TextLink href="/forgot-password" label="Forgotten your password?" />
      <View style={styles.switch}>
        <Text color="textMuted">New here?</Text>
        <TextLink href={{ pathname: '/sign-up', params: next ? { next } : {} }} label="Create an account" />
      </View>
    </AuthCard>
  );
}

const styles = StyleSheet.create({ switch: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', columnGap: 6 } });
