import { zodResolver } from '@hookform/resolvers/zod';
import { router, useLocalSearchParams } from 'expo-router';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { useForm } from 'react-hook-form';
import { PASSWORD_MIN_LENGTH, signUpInputSchema, type SignUpInput } from '../../shared/schemas/auth';
import { PREFERRED_FOOD_TABLE_CHOICES } from '../../shared/schemas/units';
import { useSignUp } from '../api/auth';
import { Button } from '../ui/button';
import { Callout } from '../ui/callout';
import { FormChoiceGroup } from '../ui/form-choice-group';
import { FormTextField } from '../ui/form-text-field';
import { applyServerErrors } from '../ui/form-errors';
import { Text } from '../ui/text';
import { TextLink } from '../ui/text-link';
import { AuthCard } from './auth-card';
import { safeNext } from './session';
import { browserTimeZone } from './browser-time-zone';
import { usePasswordEstimator } from './use-password-estimator';

export function SignUpScreen() {
  const { next } = useLocalSearchParams<{ next?: string }>();
  const signUp = useSignUp();
  usePasswordEstimator();
  const [formError, setFormError] = useState<string>();
  const form = useForm<SignUpInput>({
    resolver: zodResolver(signUpInputSchema),
    defaultValues: { email: '', displayName: '', password: '', preferredFoodTable: 'usda_sr28' },
  });

  const onSubmit = form.handleSubmit((values) => {
    setFormError(undefined);
    signUp.mutate({ ...values, timeZone: browserTimeZone() }, {
      onSuccess: () => router.replace(safeNext(next)),
      onError: (error) => setFormError(applyServerErrors(error, form.setError, ['email', 'displayName', 'password', 'preferredFoodTable'])),
    });
  });

  return (
    <AuthCard title="Create an account">
      {formError ? <Callout tone="danger" title="Account not created">{formError}</Callout> : null}
      <FormTextField control={form.control} name="displayName" label="Your name" autoComplete="name" />
      <FormTextField control={form.control} name="email" label="Email" autoComplete="email" keyboardType="email-address" autoCapitalize="none" inputMode="email" />
      <FormTextField
        control={form.control}
        name="password"
        label="Password"
        hint={`At least ${PASSWORD_MIN_LENGTH} characters, not a common password or your e-mail address. A few unrelated words work well.`}
        secureTextEntry
        autoComplete="new-password"
        onSubmitEditing={onSubmit}
      />
      <FormChoiceGroup
        control={form.control}
        name="preferredFoodTable"
        label="Food table to show first"
        choices={PREFERRED_FOOD_TABLE_CHOICES}
        hint="Both are searched. You can change this later in settings."
      />
      <Button label="Create account" size="lg" loading={signUp.isPending} onPress={onSubmit} />
      <View style={styles.switch}>
        <Text color="textMuted">Already have an account?</Text>
        <TextLink href={{ pathname: '/sign-in', params: next ? { next } : {} }} label="Sign in" />
      </View>
    </AuthCard>
  );
}

const styles = StyleSheet.create({ switch: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', columnGap: 6 } });
