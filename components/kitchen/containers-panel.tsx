import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { createContainerInputSchema, type ContainerKind } from '../../shared/schemas/container';
import { useContainers, useCreateContainer, useDeleteContainer } from '../api/containers';
import { Button } from '../ui/button';
import { Callout } from '../ui/callout';
import { Card } from '../ui/card';
import { applyServerErrors } from '../ui/form-errors';
import { FormChoiceGroup } from '../ui/form-choice-group';
import { FormTextField } from '../ui/form-text-field';
import { requestFormSchema } from '../ui/request-form-schema';
import { Text } from '../ui/text';
import { gramsText } from './kitchen-format';

export type ContainerFormValues = { name: string; kind: ContainerKind; tareGrams: string };
const FIELDS = ['name', 'kind', 'tareGrams'] as const;
const EMPTY: ContainerFormValues = { name: '', kind: 'container', tareGrams: '' };

/** The request body: an empty weight left blank is missing (not 0 g), so the schema asks for it. */
export const toContainerRequest = (v: ContainerFormValues) => ({ ...v, tareGrams: v.tareGrams.trim() === '' ? undefined : v.tareGrams });

const containerFormSchema = requestFormSchema(createContainerInputSchema, (v: ContainerFormValues) => ({
  request: toContainerRequest(v),
  fieldOf: (path) => FIELDS.find((f) => f === path),
}));

/** Saved pots and containers with their empty weights, so weighing needs only the gross reading. */
export function ContainersPanel({ profileId }: { profileId: number }) {
  const containers = useContainers(profileId);
  const create = useCreateContainer(profileId);
  const remove = useDeleteContainer(profileId);
  const form = useForm({ resolver: zodResolver(containerFormSchema), defaultValues: EMPTY });
  const [formError, setFormError] = useState<string>();

  const save = form.handleSubmit((input) => {
    setFormError(undefined);
    create.mutate(input, {
      onSuccess: () => form.reset(EMPTY),
      onError: (e) => setFormError(applyServerErrors(e, form.setError, FIELDS)),
    });
  });

  return (
    <Card>
      <Text variant="heading">Pots and containers</Text>
      <Text color="textMuted">Weigh each one empty once. Cooking then subtracts its weight (the tare) for you.</Text>
      {(containers.data ?? []).map((c) => (
        <View key={c.id} style={styles.row}>
          <Text style={styles.grow}>
            {c.kind === 'pot' ? 'Pot' : 'Container'}: {c.name} · empty {gramsText(c.tareGrams)}
          </Text>
          <Button variant="quiet" label={`Remove ${c.name}`} onPress={() => remove.mutate(c.id)} />
        </View>
      ))}
      <FormChoiceGroup
        control={form.control}
        name="kind"
        label="Kind"
        choices={[
          { value: 'container', label: 'Container' },
          { value: 'pot', label: 'Cooking pot' },
        ]}
      />
      <FormTextField control={form.control} name="name" label="Name" placeholder="e.g. Glass jar with blue lid" />
      <FormTextField control={form.control} name="tareGrams" label="Empty weight" unit="g" keyboardType="decimal-pad" />
      {formError ? <Callout tone="danger">{formError}</Callout> : null}
      <Button variant="secondary" label="Save container" loading={create.isPending} onPress={() => void save()} />
    </Card>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', alignItems: 'center', gap: 8 },
  grow: { flex: 1 },
});
