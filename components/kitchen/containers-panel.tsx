import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { createContainerInputSchema, type ContainerKind } from '../../shared/schemas/container';
import { ApiError } from '../api/client';
import { Button } from '../ui/button';
import { Card } from '../ui/card';
import { Text } from '../ui/text';
import { TextField } from '../ui/text-field';
import { ChoiceGroup } from '../ui/choice-group';
import { gramsText } from './kitchen-format';
import { useContainers, useCreateContainer, useDeleteContainer } from '../api/containers';

/** Saved pots and containers with their empty weights, so weighing needs only the gross reading. */
export function ContainersPanel({ profileId }: { profileId: number }) {
  const containers = useContainers(profileId);
  const create = useCreateContainer(profileId);
  const remove = useDeleteContainer(profileId);
  const [name, setName] = useState('');
  const [tare, setTare] = useState('');
  const [kind, setKind] = useState<ContainerKind>('container');
  const [errors, setErrors] = useState<Record<string, string>>({});

  const save = () => {
    const parsed = createContainerInputSchema.safeParse({ name, kind, tareGrams: tare.trim() === '' ? undefined : tare });
    if (!parsed.success) {
      setErrors(Object.fromEntries(parsed.error.issues.map((i) => [String(i.path[0]), i.message])));
      return;
    }
    setErrors({});
    create.mutate(parsed.data, {
      onSuccess: () => {
        setName('');
        setTare('');
      },
      onError: (e) => setErrors(e instanceof ApiError ? Object.fromEntries(Object.entries(e.fieldErrors ?? { name: [e.message] }).map(([k, v]) => [k, v[0]])) : {}),
    });
  };

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
      <ChoiceGroup
        label="Kind"
        value={kind}
        onChange={setKind}
        choices={[
          { value: 'container', label: 'Container or jar' },
          { value: 'pot', label: 'Cooking pot' },
        ]}
      />
      <TextField label="Name" value={name} onChangeText={setName} error={errors.name} placeholder="e.g. Glass jar with blue lid" />
      <TextField label="Empty weight" unit="g" keyboardType="decimal-pad" value={tare} onChangeText={setTare} error={errors.tareGrams} />
      <Button variant="secondary" label="Save container" loading={create.isPending} onPress={save} />
    </Card>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', alignItems: 'center', gap: 8 },
  grow: { flex: 1 },
});
