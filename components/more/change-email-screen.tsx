import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { emailChangeInputSchema, type EmailChangeInput } from '../../shared/schemas/auth';
import { useMe, useRequestEmailChange } from '../api/auth';
import { Button } from '../ui/button';
import { Callout } from '../ui/callout';
import { Card } from '../ui/card';
import { FormTextField } from '../ui/form-text-field';
import { applyServerErrors } from '../ui/form-errors';
import { Screen } from '../ui/screen';
import { Text } from '../ui/text';

/** Asks to move the account to a new e-mail address; nothing changes until the link sent there is opened. */
export function ChangeEmailScreen() {
  const me = useMe();
  const request = useRequestEmailChange();
  const [formError, setFormError] = useState<string>();
  const form = useForm<EmailChangeInput>({
    resolver: zodResolver(emailChangeInputSchema),
    defaultValues: { newEmail: '', currentPassword: '' },
  });
  const onSubmit = form.handleSubmit((values) => {
    setFormError(undefined);
    request.mutate(values, {
      onSuccess: () => form.reset(),
      onError: (error) => setFormError(applyServerErrors(error, form.setError, ['newEmail', 'currentPassword'])),
    });
  });
  return (
    <Screen title="Change e-mail address" subtitle={me.data ? `Now ${me.data.user.email}` : undefined} backHref="/more">
      <Card>
        <Text color="textMuted">
          We send a link to the new address. Your address changes only when you open that link while signed in here; then
          other devices are signed out and the old address gets a note of the change.
        </Text>
        {request.isSuccess ? (
          <Callout tone="ok" title="Check the new inbox">
            {request.data.message}
          </Callout>
        ) : null}
        {formError ? <Callout tone="danger">{formError}</Callout> : null}
        <FormTextField control={form.control} name="newEmail" label="New e-mail address" inputMode="email" autoCapitalize="none" autoComplete="email" />
        <FormTextField control={form.control} name="currentPassword" label="Current password" secureTextEntry autoComplete="current-password" onSubmitEditing={onSubmit} />
        <Button label="Send the confirmation link" loading={request.isPending} onPress={onSubmit} />
      </Card>
    </Screen>
  );
}
