import { useActiveProfile } from '../api/auth';
import { Screen } from '../ui/screen';
import { LoadingState } from '../ui/states';
import { RecipeDetailView } from './recipe-detail';

/** The recipe page on its own (phone, deep links). */
export function RecipeDetailScreen({ id }: { id: number }) {
  const { profile, isPending } = useActiveProfile();
  return (
    <Screen backHref="/recipes">
      {isPending ? <LoadingState /> : <RecipeDetailView id={id} profileId={profile?.id} />}
    </Screen>
  );
}
