import { router } from 'expo-router';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import type { Food } from '../../shared/schemas/food';
import { ApiError } from '../api/client';
import { useDeletePackFood, useUpdatePackFood } from '../api/foods';
import { Button } from '../ui/button';
import { Callout } from '../ui/callout';
import { Card } from '../ui/card';
import { Text } from '../ui/text';
import { PackFoodForm } from './pack-food-form';
import { packFoodValuesOf } from './pack-food-form-values';
import { usePackFoodShareOptions } from './pack-food-share';

/** Edits one of your pack foods in place; recipes using it count the new values from now on, cooked batches keep theirs. */
export function EditPackFood({ food, onDone }: { food: Food; onDone: () => void }) {
  const { shareOptions } = usePackFoodShareOptions();
  const update = useUpdatePackFood(food.id);
  return (
    <View style={styles.wrap}>
      <Callout tone="info" title="What an edit changes">
        Recipes that use this pack food count the new values from now on. Batches you have already cooked keep the values
        they were cooked with.
      </Callout>
      <PackFoodForm
        defaultValues={packFoodValuesOf(food)}
        shareOptions={shareOptions}
        withPhoto={false}
        submitLabel="Save pack food"
        submitting={update.isPending}
        submitError={update.error}
        onSubmit={(values) => update.mutate(values, { onSuccess: onDone })}
      />
      <Button variant="secondary" label="Cancel" onPress={onDone} />
    </View>
  );
}

/** Deletes one of your pack foods after a second press; while your recipes use it, says which. */
export function DeletePackFood({ food }: { food: Food }) {
  const remove = useDeletePackFood();
  const [sure, setSure] = useState(false);
  const err = remove.error;
  const usedIn = err instanceof ApiError && err.status === 409 ? (err.fieldErrors?.recipes ?? []) : [];
  return (
    <Card>
      <Text variant="heading">Delete this pack food</Text>
      {usedIn.length ? (
        <Callout tone="caution" title="Still used in your recipes">
          <View role="list" aria-label="Recipes that use this pack food">
            {usedIn.map((title) => (
              <Text key={title} role="listitem">
                • {title}
              </Text>
            ))}
          </View>
          <Text>Remove it from these recipes first, then delete it.</Text>
        </Callout>
      ) : err ? (
        <Callout tone="danger" title="Not deleted">{err.message}</Callout>
      ) : null}
      <Button
        variant="danger"
        label={sure ? 'Yes, delete it' : 'Delete pack food'}
        loading={remove.isPending}
        onPress={() => {
          if (!sure) return setSure(true);
          remove.mutate(food.id, { onSuccess: () => router.replace('/foods'), onSettled: () => setSure(false) });
        }}
      />
    </Card>
  );
}

const styles = StyleSheet.create({ wrap: { gap: 16 } });
