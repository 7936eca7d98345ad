import { router } from 'expo-router';
import { useMe } from '../api/auth';
import { useCreateLabelFood } from '../api/foods';
import { Screen } from '../ui/screen';
import { ErrorState, LoadingState } from '../ui/states';
import { LabelFoodForm, type ShareOption } from './label-food-form';

/** Add a food from a package label; afterwards its page opens. */
export function LabelFoodScreen() {
  const me = useMe();
  const create = useCreateLabelFood();
  if (me.isPending) return <LoadingState />;
  if (me.isError) return <ErrorState error={me.error} onRetry={() => void me.refetch()} />;
  const shareOptions: ShareOption[] = [
    { profileId: null, label: 'Only me' },
    ...me.data.profiles
      .filter((p) => p.access === 'owner' || p.access === 'carer')
      .map((p) => ({ profileId: p.id, label: `Everyone who looks after ${p.displayName}` })),
  ];
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
