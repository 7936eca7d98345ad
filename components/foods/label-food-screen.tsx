import { router } from 'expo-router';
import { useCreateLabelFood } from '../api/foods';
import { Screen } from '../ui/screen';
import { ErrorState, LoadingState } from '../ui/states';
import { LabelFoodForm } from './label-food-form';
import { usePackFoodShareOptions } from './pack-food-share';

/** Add a food from a package label; afterwards its page opens. */
export function LabelFoodScreen() {
  const { me, shareOptions } = usePackFoodShareOptions();
  const create = useCreateLabelFood();
  if (me.isPending) return <LoadingState />;
  if (me.isError) return <ErrorState error={me.error} onRetry={() => void me.refetch()} />;
  return (
    <Screen title="Add a label food" subtitle="Type the nutrition panel of a package" backHref="/foods">
      <LabelFoodForm
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
