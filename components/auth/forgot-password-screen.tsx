import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { passwordResetRequestInputSchema, type PasswordResetRequestInput } from '../../shared/schemas/auth';
import { useRequestPasswordReset } from '../api/auth';
import { Button } from '../ui/button';
import { Callout } from '../ui/callout';
import { FormTextField } from '../ui/form-text-field';
import { applyServerErrors } from '../ui/form-errors';
import { Text } from '../ui/text';
import { TextLink } from '../ui/text-link';
import { AuthCard } from './auth-card';

/** Asks for a password reset link by e-mail; says the same whether or not an account uses the address. */
export function ForgotPasswordScreen() {
  const request = useRequestPasswordReset();
  const [formError, setFormError] = useState<string>();
  const form = useForm<PasswordResetRequestInput>({ resolver: zodResolver(passwordResetRequestInputSchema), defaultValues: { email: '' } });

  const onSubmit = form.handleSubmit((values) => {
    setFormError(undefined);
    request.mutate(values, { onError: (error) => setFormError(applyServerErrors(error, form.setError, ['email'])) });
  });

  return (
    <AuthCard title="Forgotten password">
      {request.data ? (
        <Callout tone="info" title="Check your e-mail">
          {request.data.message}
        </Callout>
      ) : (
        <>
          {formError ? <Callout tone="danger" title="Not sent">{formError}</Callout> : null}
          <Text>Enter the e-mail address you sign in with. We will send a link to choose a new password.</Text>
          <FormTextField control={form.control} name="email" label="Email" autoComplete="email" keyboardType="email-address" autoCapitalize="none" inputMode="email" onSubmitEditing={onSubmit} />
          <Button label="Send the link" size="lg" loading={request.isPending} onPress={onSubmit} />
        </>
      )}
      <TextLink href="/sign-in" label="Back to sign in" />
    </AuthCard>
  );
}
