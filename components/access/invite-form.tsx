import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { invitationInputSchema } from '../../shared/schemas/access';
import type { ProfileAccessRole } from '../../shared/schemas/auth';
import { useInvite } from '../api/access';
import { Button } from '../ui/button';
import { Card } from '../ui/card';
import { applyServerErrors } from '../ui/form-errors';
import { FormChoiceGroup } from '../ui/form-choice-group';
import { FormTextField } from '../ui/form-text-field';
import { requestFormSchema } from '../ui/request-form-schema';
import { Text } from '../ui/text';

type Values = { email: string; role: ProfileAccessRole; extra: boolean };
const EXTRA = { owner: null, carer: 'settings', clinician: 'ratios' } as const;

/** The form's values as the invitation body: the yes/no becomes the role's one extra permission. */
export function toInvitationRequest(v: Values) {
  const extra = EXTRA[v.role];
  return {
    request: { email: v.email, role: v.role, permissions: v.extra && extra ? [extra] : [] },
    fieldOf: (path: string) => (path.startsWith('permissions') ? 'extra' : path.split('.')[0]),
  };
}

const schema = requestFormSchema(invitationInputSchema, toInvitationRequest);

/** Invite someone by e-mail as carer or clinician (or, for a profile you keep for someone, as its new owner). */
export function InviteForm({ profileId, managed }: { profileId: number; managed: boolean }) {
  const form = useForm<Values, unknown, ReturnType<typeof schema.parse>>({ resolver: zodResolver(schema), defaultValues: { email: '', role: 'carer', extra: false } });
  const invite = useInvite(profileId);
  const role = form.watch('role');
  const submit = form.handleSubmit((body) =>
    invite.mutate(body, {
      onSuccess: () => form.reset({ email: '', role: 'carer', extra: false }),
      onError: (err) => {
        const rest = applyServerErrors(err, form.setError, ['email', 'role']);
        if (rest) form.setError('email', { message: rest });
      },
    }),
  );
  const roles = [
    { value: 'carer' as const, label: 'Carer: plans, cooks, logs and doses' },
    { value: 'clinician' as const, label: 'Clinician: reads everything' },
    ...(managed ? [{ value: 'owner' as const, label: 'Owner: hand this profile over' }] : []),
  ];
  return (
    <Card>
      <Text variant="heading">Invite someone</Text>
      <Text color="textMuted">They get an e-mail with a link that works once, for 7 days, and only for that address.</Text>
      <FormTextField control={form.control} name="email" label="Their email address" inputMode="email" autoCapitalize="none" />
      <FormChoiceGroup control={form.control} name="role" label="As" choices={roles} />
      {role !== 'owner' ? (
        <FormChoiceGroup
          control={form.control}
          name="extra"
          label={role === 'carer' ? 'May they change settings, kinds of day and ratios?' : 'May they change kinds of day and ratios?'}
          choices={[
            { value: false, label: 'No' },
            { value: true, label: 'Yes' },
          ]}
        />
      ) : null}
      <Button label="Send invitation" onPress={() => void submit()} loading={invite.isPending} />
      {invite.isSuccess ? <Text color="textMuted">Invitation sent.</Text> : null}
    </Card>
  );
}
