import { router } from 'expo-router';
import { useCreatePackFood } from '../api/foods';
import { Screen } from '../ui/screen';
import { ErrorState, LoadingState } from '../ui/states';
import { PackFoodForm } from './pack-food-form';
import { usePackFoodShareOptions } from './pack-food-share';

/** Add a food from a package label; afterwards its page opens. */
export function PackFoodScreen() {
  const { me, shareOptions } = usePackFoodShareOptions();
  const create = useCreatePackFood();
  if (me.isPending) return <LoadingState />;
  if (me.isError) return <ErrorState error={me.error} onRetry={() => void me.refetch()} />;
  return (
    <Screen title="Add a pack food" subtitle="Type the nutrition panel of a package" backHref="/foods">
      <PackFoodForm
        shareOptions={shareOptions}
        submitting={create.isPending}
        submitError={create.error}
        onSubmit={(values, photo) =>
          create.mutate({ values, photo }, { onSuccess: ({ food }) => router.replace(`/foods/${food.id}`) })
        }
      />
    </Screen>
  );
}
