import { zodResolver } from '@hookform/resolvers/zod';
import { router } from 'expo-router';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { managedProfileInputSchema, PROFILE_COLOURS, type ManagedProfileInput } from '../../shared/schemas/access';
import { useCreateManagedProfile } from '../api/access';
import { browserTimeZone } from '../auth/browser-time-zone';
import { ProfileDot } from '../nav/profile-switcher';
import { Button } from '../ui/button';
import { Callout } from '../ui/callout';
import { Card } from '../ui/card';
import { applyServerErrors } from '../ui/form-errors';
import { FormChoiceGroup } from '../ui/form-choice-group';
import { FormTextField } from '../ui/form-text-field';
import { Screen } from '../ui/screen';
import { Text } from '../ui/text';

const COLOUR_CHOICES = PROFILE_COLOURS.map((c) => ({ value: c, label: c[0].toUpperCase() + c.slice(1) }));

/**
 * A profile kept for someone without an account (a child): the carer owns it until handing it over. Once made it is
 * the active profile, and the page for inviting others (or its new owner) opens.
 */
export function NewProfileScreen() {
  const create = useCreateManagedProfile();
  const [formError, setFormError] = useState<string>();
  const form = useForm<ManagedProfileInput>({
    resolver: zodResolver(managedProfileInputSchema),
    defaultValues: { displayName: '', colour: undefined, timeZone: browserTimeZone() },
  });
  const [name, colour] = form.watch(['displayName', 'colour']);
  const onSubmit = form.handleSubmit((values) => {
    setFormError(undefined);
    create.mutate(values, {
      onSuccess: () => router.replace('/more/people'),
      onError: (error) => setFormError(applyServerErrors(error, form.setError, ['displayName', 'colour', 'timeZone'])),
    });
  });
  return (
    <Screen title="Add a profile for someone you care for" backHref="/more">
      <Card>
        <Text color="textMuted">
          For someone without their own account, such as a child. You own it: you plan, cook, log and check doses for
          them, and can invite a carer or clinician. When they are ready, invite them as its owner from People with access
          to hand it over.
        </Text>
        {formError ? <Callout tone="danger">{formError}</Callout> : null}
        <FormTextField control={form.control} name="displayName" label="Their name" autoComplete="off" />
        <FormChoiceGroup
          control={form.control}
          name="colour"
          label="Colour"
          choices={COLOUR_CHOICES}
          hint="Shown beside their name wherever their numbers are. Leave it and we pick one your other profiles do not wear."
        />
        {colour ? (
          <View style={styles.preview}>
            <ProfileDot profile={{ colour }} />
            <Text weight="bold">{name.trim() || 'Their name'}</Text>
          </View>
        ) : null}
        <FormTextField
          control={form.control}
          name="timeZone"
          label="Time zone"
          autoCapitalize="none"
          hint="Where their day starts for the logbook and the kinds of day. A name such as Europe/London."
        />
        <Button label="Add the profile" loading={create.isPending} onPress={onSubmit} />
      </Card>
    </Screen>
  );
}

const styles = StyleSheet.create({ preview: { flexDirection: 'row', alignItems: 'center', gap: 8 } });
