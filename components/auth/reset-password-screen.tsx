import { zodResolver } from '@hookform/resolvers/zod';
import { router } from 'expo-router';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { passwordResetInputSchema, PASSWORD_MIN_LENGTH, type PasswordResetInput } from '../../shared/schemas/auth';
import { useResetPassword } from '../api/auth';
import { Button } from '../ui/button';
import { Callout } from '../ui/callout';
import { FormTextField } from '../ui/form-text-field';
import { applyServerErrors } from '../ui/form-errors';
import { TextLink } from '../ui/text-link';
import { AuthCard } from './auth-card';
import { usePasswordEstimator } from './use-password-estimator';

/** Chooses a new password with the token from the mailed link; then signed in, every other device signed out. */
export function ResetPasswordScreen({ token }: { token: string }) {
  const reset = useResetPassword();
  usePasswordEstimator();
  const [formError, setFormError] = useState<string>();
  const form = useForm<PasswordResetInput>({ resolver: zodResolver(passwordResetInputSchema), defaultValues: { token, password: '' } });

  const onSubmit = form.handleSubmit((values) => {
    setFormError(undefined);
    reset.mutate(values, {
      onSuccess: () => router.replace('/'),
      // A bad token has no field on this form: it is shown above it.
      onError: (error) => setFormError(applyServerErrors(error, form.setError, ['password'])),
    });
  });

  return (
    <AuthCard title="Choose a new password">
      {formError || !token ? (
        <Callout tone="danger" title="Password not changed">
          {formError ?? 'This link is incomplete. Ask for a new one.'}
        </Callout>
      ) : null}
      <FormTextField
        control={form.control}
        name="password"
        label="New password"
        hint={`At least ${PASSWORD_MIN_LENGTH} characters, not a common password. A few unrelated words work well.`}
        secureTextEntry
        autoComplete="new-password"
        onSubmitEditing={onSubmit}
      />
      <Button label="Save the new password" size="lg" loading={reset.isPending} onPress={onSubmit} />
      <TextLink href="/forgot-password" label="Ask for a new link" />
    </AuthCard>
  );
}
