import { Link } from 'expo-router';
import { useActiveProfile } from '../api/auth';
import { useFood } from '../api/foods';
import { Button } from '../ui/button';
import { Screen } from '../ui/screen';
import { ErrorState, LoadingState } from '../ui/states';
import { sourceShort } from './food-carb';
import { FoodDetail } from './food-detail';

/** One food's page (phone, or a deep link on a wide screen). */
export function FoodDetailScreen({ id }: { id: number }) {
  const food = useFood(id);
  const { profile } = useActiveProfile();
  if (food.isPending) return <LoadingState />;
  if (food.isError) return <ErrorState error={food.error} onRetry={() => void food.refetch()} />;
  return (
    <Screen
      title={food.data.name}
      subtitle={`${sourceShort(food.data)}${food.data.group ? ` · ${food.data.group}` : ''}`}
      backHref="/foods"
      actions={
        <Link href="/foods" asChild>
          <Button variant="secondary" label="Search foods" />
        </Link>
      }
    >
      <FoodDetail food={food.data} basis={profile?.carbBasis ?? 'available'} unit={profile?.carbUnit ?? 'g'} />
    </Screen>
  );
}
