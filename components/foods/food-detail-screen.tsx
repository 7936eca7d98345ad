import { Link } from 'expo-router';
import { useState } from 'react';
import { useActiveProfile, useMe } from '../api/auth';
import { useFood } from '../api/foods';
import { Button } from '../ui/button';
import { Screen } from '../ui/screen';
import { ErrorState, LoadingState } from '../ui/states';
import { sourceShort } from './food-carb';
import { FoodDetail } from './food-detail';
import { DeletePackFood, EditPackFood } from './pack-food-edit';

/** One food's page (phone, or a deep link on a wide screen); your own pack foods can be edited and deleted here. */
export function FoodDetailScreen({ id }: { id: number }) {
  const food = useFood(id);
  const me = useMe();
  const { profile } = useActiveProfile();
  const [editing, setEditing] = useState(false);
  if (food.isPending) return <LoadingState />;
  if (food.isError) return <ErrorState error={food.error} onRetry={() => void food.refetch()} />;
  const mine = food.data.source === 'pack' && me.data != null && food.data.ownerUserId === me.data.user.id;
  return (
    <Screen
      title={editing ? `Edit ${food.data.name}` : food.data.name}
      subtitle={`${sourceShort(food.data)}${food.data.group ? ` · ${food.data.group}` : ''}`}
      backHref="/foods"
      actions={
        mine && !editing ? (
          <Button variant="secondary" label="Edit pack food" onPress={() => setEditing(true)} />
        ) : (
          <Link href="/foods" asChild>
            <Button variant="secondary" label="Search foods" />
          </Link>
        )
      }
    >
      {editing ? (
        <EditPackFood food={food.data} onDone={() => setEditing(false)} />
      ) : (
        <>
          <FoodDetail food={food.data} basis={profile?.carbBasis ?? 'available'} unit={profile?.carbUnit ?? 'g'} />
          {mine ? <DeletePackFood food={food.data} /> : null}
        </>
      )}
    </Screen>
  );
}
