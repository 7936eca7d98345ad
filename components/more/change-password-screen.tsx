import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { PASSWORD_MIN_LENGTH, changePasswordInputSchema, type ChangePasswordInput } from '../../shared/schemas/auth';
import { useChangePassword } from '../api/auth';
import { Button } from '../ui/button';
import { Callout } from '../ui/callout';
import { Card } from '../ui/card';
import { FormTextField } from '../ui/form-text-field';
import { usePasswordEstimator } from '../auth/use-password-estimator';
import { applyServerErrors } from '../ui/form-errors';
import { Screen } from '../ui/screen';

/** Change password; every other signed-in device is signed out by it. */
export function ChangePasswordScreen() {
  const change = useChangePassword();
  usePasswordEstimator();
  const [formError, setFormError] = useState<string>();
  const form = useForm<ChangePasswordInput>({
    resolver: zodResolver(changePasswordInputSchema),
    defaultValues: { currentPassword: '', newPassword: '' },
  });
  const onSubmit = form.handleSubmit((values) => {
    setFormError(undefined);
    change.mutate(values, {
      onSuccess: () => form.reset(),
      onError: (error) => setFormError(applyServerErrors(error, form.setError, ['currentPassword', 'newPassword'])),
    });
  });
  return (
    <Screen title="Change password" backHref="/more">
      <Card>
        {change.isSuccess ? (
          <Callout tone="ok" title="Password changed">
            Other devices where you were signed in have been signed out.
          </Callout>
        ) : null}
        {formError ? <Callout tone="danger">{formError}</Callout> : null}
        <FormTextField control={form.control} name="currentPassword" label="Current password" secureTextEntry autoComplete="current-password" />
        <FormTextField
          control={form.control}
          name="newPassword"
          label="New password"
          hint={`At least ${PASSWORD_MIN_LENGTH} characters.`}
          secureTextEntry
          autoComplete="new-password"
        />
        <Button label="Change password" loading={change.isPending} onPress={onSubmit} />
      </Card>
    </Screen>
  );
}
